import type { PlanKind } from '../api/get-dues-plans';
import type { DuesStatus, InvoiceStatus, PaymentMethod } from '../api/get-my-dues';

export type Tone = 'good' | 'warn' | 'bad' | 'none';

export const DUES_STATUS: Record<DuesStatus, { label: string; tone: Tone }> = {
  current: { label: 'Paid up', tone: 'good' },
  grace: { label: 'Due now', tone: 'warn' },
  lapsed: { label: 'Overdue', tone: 'bad' },
  lifetime: { label: 'Lifetime member', tone: 'good' },
  honorary: { label: 'Honorary member', tone: 'good' },
};

export const NOT_PAID_YET: { label: string; tone: Tone } = { label: 'Not paid yet', tone: 'warn' };

export const duesStatusLabel = (status: string) => DUES_STATUS[status as DuesStatus]?.label ?? status;

export const DUES_STATUS_OPTIONS = (Object.keys(DUES_STATUS) as DuesStatus[]).map((value) => ({ value, label: DUES_STATUS[value].label }));

export const INVOICE_STATUS: Record<InvoiceStatus, string> = {
  open: 'Not paid yet',
  paid: 'Paid',
  void: 'Cancelled',
  refunded: 'Refunded',
  partially_refunded: 'Partly refunded',
};

/** "2027" → "Dues for 2027"; a label that already says what it is stays as it is. */
export const paymentLabel = (label: string) => (/\p{L}/u.test(label) ? label : `Dues for ${label}`);

export const invoiceStatusLabel = (status: string) => INVOICE_STATUS[status as InvoiceStatus] ?? status;

export const INVOICE_STATUS_OPTIONS = (Object.keys(INVOICE_STATUS) as InvoiceStatus[]).map((value) => ({
  value,
  label: INVOICE_STATUS[value],
}));

export const METHOD: Record<PaymentMethod, string> = { card: 'Card', cash: 'Cash', cheque: 'Cheque' };

export const methodLabel = (method: string | null | undefined) => (method ? (METHOD[method as PaymentMethod] ?? method) : '');

export const METHOD_OPTIONS = (Object.keys(METHOD) as PaymentMethod[]).map((value) => ({ value, label: METHOD[value] }));

export const PLAN_KIND: Record<PlanKind, string> = {
  standard: 'Standard: one member',
  household: 'Household: people living together',
  lifetime: 'Lifetime: pays no more dues',
  honorary: 'Honorary: given by the guild, no dues',
};

export const PLAN_KIND_SHORT: Record<PlanKind, string> = {
  standard: 'Standard',
  household: 'Household',
  lifetime: 'Lifetime',
  honorary: 'Honorary',
};

export const PLAN_KIND_OPTIONS = (Object.keys(PLAN_KIND) as PlanKind[]).map((value) => ({ value, label: PLAN_KIND[value] }));

/** Plans whose members pay nothing. */
export const isFreeKind = (kind: string) => kind === 'lifetime' || kind === 'honorary';
