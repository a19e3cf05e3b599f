import type { MyDues } from '../api/get-my-dues';
import { formatDay } from '../lib/format';
import { DuesStatusBadge } from './status-badge';

/** No payment on record at all: a new member, not a late one. */
export const neverPaid = (dues: Pick<MyDues, 'paidThrough' | 'history'>) =>
  dues.paidThrough === null && !dues.history.some((h) => h.status === 'paid' || h.status === 'partially_refunded');

/** One or two plain sentences under the badge: what her status means and what to do. */
export function standingSentence(dues: Pick<MyDues, 'status' | 'statusEndsOn' | 'paidThrough'>, onDuesPage = true): string {
  const until = formatDay(dues.statusEndsOn);
  const payHere = onDuesPage ? 'Pay below' : 'Pay on your dues page';
  switch (dues.status) {
    case 'current':
      return dues.paidThrough ? `Your dues are paid through ${formatDay(dues.paidThrough)}.` : 'Your dues are paid.';
    case 'grace':
      return until ? `Your dues are due. Please pay by ${until} to avoid a late fee.` : 'Your dues are due. Please pay soon.';
    case 'lapsed':
      return dues.paidThrough
        ? `Your dues were paid through ${formatDay(dues.paidThrough)}. ${payHere} to renew your membership.`
        : `We have no dues payment from you yet. ${payHere} to become a paid-up member.`;
    case 'lifetime':
      return 'You are a lifetime member. You pay no dues.';
    case 'honorary':
      return 'You are an honorary member. You pay no dues.';
    default:
      return '';
  }
}

/** Her status as a badge and a sentence, plus her plan and household. */
export function DuesStanding({ dues }: { dues: MyDues }) {
  return (
    <div className="dues-standing">
      <p className="mb-2">
        <span className="visually-hidden">Your status: </span>
        <DuesStatusBadge status={dues.status} neverPaid={neverPaid(dues)} />
      </p>
      <p className="fs-5 mb-2">{standingSentence(dues)}</p>
      {dues.plan && (
        <p className="mb-1">
          Plan: <strong>{dues.plan.name}</strong>
        </p>
      )}
      {dues.household && (
        <p className="mb-1">
          Household: <strong>{dues.household.name}</strong>
          {dues.household.members.length > 0 && <> ({dues.household.members.join(', ')})</>}
        </p>
      )}
    </div>
  );
}
