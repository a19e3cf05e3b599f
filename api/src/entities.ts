import { PasswordReset } from './auth/password-reset.entity';
import { SignInFailure } from './auth/sign-in-attempt.entity';
import { BeeMember } from './bees/bee-member.entity';
import { Bee } from './bees/bee.entity';
import { BeeSlot } from './bees/bee-slot.entity';
import { RoundBlock } from './rounds/round-block.entity';
import { SizeCheck } from './size-check/size-check.entity';
import { RoundFile } from './rounds/round-file.entity';
import { Round } from './rounds/round.entity';
import { Guild } from './guilds/guild.entity';
import { Membership } from './guilds/membership.entity';
import { Invitation } from './invitations/invitation.entity';
import { OutboxMessage } from './outbox/outbox-message.entity';
import { SessionRecord } from './sessions/session-record.entity';
import { User } from './users/user.entity';
import { DuesInvoice } from './dues/dues-invoice.entity';
import { DuesPayment } from './dues/dues-payment.entity';
import { DuesPlan } from './dues/dues-plan.entity';
import { DuesRefund } from './dues/dues-refund.entity';
import { DuesSettingsRecord } from './dues/dues-settings.entity';
import { DuesStanding } from './dues/dues-standing.entity';
import { Household } from './dues/household.entity';
import { MoneyAuditEntry } from './dues/money-audit.entity';
import { PaymentWebhookEvent } from './dues/payment-webhook-event.entity';
import { ReceiptCounter } from './dues/receipt-counter.entity';
import { BallotCode, ShowBallot, ShowVoter, TieDecisionRecord } from './shows/ballot.entity';
import { ShowCategory } from './shows/show-category.entity';
import { ShowEntry } from './shows/show-entry.entity';
import { Show } from './shows/show.entity';
import { OfficeTerm } from './offices/office-term.entity';

/** Every entity, listed once for the app, the CLI and the tests. */
export const ENTITIES = [
  User,
  Guild,
  Membership,
  Invitation,
  PasswordReset,
  SignInFailure,
  SessionRecord,
  OutboxMessage,
  Bee,
  BeeMember,
  BeeSlot,
  Round,
  RoundFile,
  RoundBlock,
  SizeCheck,
  DuesSettingsRecord,
  DuesPlan,
  Household,
  DuesStanding,
  DuesInvoice,
  DuesPayment,
  DuesRefund,
  ReceiptCounter,
  PaymentWebhookEvent,
  MoneyAuditEntry,
  Show,
  ShowCategory,
  ShowEntry,
  BallotCode,
  ShowVoter,
  ShowBallot,
  TieDecisionRecord,
  OfficeTerm,
];
