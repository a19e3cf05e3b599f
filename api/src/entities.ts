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
];
