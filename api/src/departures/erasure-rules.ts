/**
 * The rules for erasing a departed member's personal data, as plain functions: who may be erased,
 * what her name becomes, and how her name leaves the show entries she made.
 */

export interface UnpaidInvoice {
  id: number;
  purpose: string;
  yearLabel: string;
  totalCents: number;
  currency: string;
}

export interface ErasureFacts {
  /** Her membership in this guild. */
  status: 'active' | 'left';
  erasedAt: Date | null;
  /** Guilds on Selvage where she is still an active member, other than this one. */
  activeElsewhere: string[];
  unpaid: UnpaidInvoice[];
}

export interface Refusal {
  code: 'still_member' | 'already_erased' | 'member_elsewhere' | 'unpaid_invoices';
  message: string;
}

/** Why this erasure cannot happen now, in words the admin can act on; empty when it may go ahead. */
export function erasureRefusals(facts: ErasureFacts, formatMoney: (cents: number, currency: string) => string): Refusal[] {
  if (facts.erasedAt) return [{ code: 'already_erased', message: 'Her personal data was already erased.' }];
  const refusals: Refusal[] = [];
  if (facts.status === 'active')
    refusals.push({ code: 'still_member', message: 'She is still a member. Record that she has left first; erasing is only for members who have gone.' });
  if (facts.activeElsewhere.length)
    refusals.push({
      code: 'member_elsewhere',
      message: `She is still a member of ${facts.activeElsewhere.join(' and ')} on Selvage, so her account stays. Only that guild can change what it keeps.`,
    });
  if (facts.unpaid.length) {
    const list = facts.unpaid.map((i) => `${i.yearLabel} ${i.purpose === 'show_entry' ? 'entry fees' : 'dues'} ${formatMoney(i.totalCents, i.currency)}`);
    refusals.push({
      code: 'unpaid_invoices',
      message: `She has ${facts.unpaid.length === 1 ? 'an unpaid invoice' : `${facts.unpaid.length} unpaid invoices`} (${list.join('; ')}). The treasurer must record the payment or void ${facts.unpaid.length === 1 ? 'it' : 'them'} first, so the books stay whole.`,
    });
  }
  return refusals;
}

/** The name her records carry after erasure: stable, unique in the guild, and saying nothing about her. */
export function formerMemberName(membershipId: number): string {
  return `Former member ${membershipId}`;
}

/**
 * Her name out of a quilt's list of makers (and the quilter line), matched as she typed it: trimmed,
 * case and spacing ignored. Co-makers keep their names.
 */
export function replaceName(names: readonly string[], oldName: string, newName: string): string[] {
  const key = (s: string) => s.trim().replace(/\s+/g, ' ').toLocaleLowerCase('en');
  const old = key(oldName);
  return names.map((n) => (key(n) === old ? newName : n));
}
