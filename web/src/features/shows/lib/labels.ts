import type { EntryStatus, EntryWindow, RankedMethod, VotingKind, VotingState } from '../api/types';

export type Tone = 'good' | 'warn' | 'bad' | 'none';

export const ENTRY_STATUS: Record<EntryStatus, { label: string; tone: Tone }> = {
  submitted: { label: 'Sent, waiting for the show chair', tone: 'warn' },
  accepted: { label: 'Accepted', tone: 'good' },
  declined: { label: 'Declined', tone: 'bad' },
  withdrawn: { label: 'Withdrawn', tone: 'none' },
};

export const ENTRY_STATUS_FILTERS = [
  { value: 'submitted', label: 'Waiting for review' },
  { value: 'accepted', label: 'Accepted' },
  { value: 'declined', label: 'Declined' },
  { value: 'withdrawn', label: 'Withdrawn' },
] as const;

export const ENTRY_WINDOW: Record<EntryWindow, { label: string; tone: Tone }> = {
  not_yet: { label: 'Entries not open yet', tone: 'none' },
  open: { label: 'Entries open', tone: 'good' },
  closed: { label: 'Entries closed', tone: 'none' },
};

export const VOTING_STATE: Record<VotingState, { label: string; tone: Tone }> = {
  not_open: { label: 'Voting not open', tone: 'none' },
  scheduled: { label: 'Voting scheduled', tone: 'warn' },
  open: { label: 'Voting open now', tone: 'good' },
  closed: { label: 'Voting closed', tone: 'none' },
};

export const VOTING_KIND_OPTIONS: readonly { value: VotingKind; label: string }[] = [
  { value: 'per_category', label: 'One vote per category (the usual viewer’s choice)' },
  { value: 'approval', label: 'Approval: vote for as many as you like in each category' },
  { value: 'ranked', label: 'Ranked: put favourite quilts in order for one overall award' },
];

export const VOTING_KIND_SHORT: Record<VotingKind, string> = {
  per_category: 'One vote per category',
  approval: 'Approval voting',
  ranked: 'Ranked choice, one overall award',
};

export const RANKED_METHOD_OPTIONS: readonly { value: RankedMethod; label: string }[] = [
  { value: 'points', label: '3/2/1 points: a 1st choice scores 3, a 2nd 2 and a 3rd 1; most points wins' },
  {
    value: 'instant_runoff',
    label: 'Instant runoff: the quilt with the fewest 1st choices drops out and its votes go to the next choice, until one has more than half',
  },
];

/** 1 → "1st", 2 → "2nd", 11 → "11th", 23 → "23rd". */
export function ordinal(n: number): string {
  const tens = n % 100;
  if (tens >= 11 && tens <= 13) return `${n}th`;
  switch (n % 10) {
    case 1:
      return `${n}st`;
    case 2:
      return `${n}nd`;
    case 3:
      return `${n}rd`;
    default:
      return `${n}th`;
  }
}

/** "No. 12" when the entry has a number; empty otherwise. */
export const entryNumberText = (entryNumber: number | null | undefined) => (entryNumber == null ? '' : `No. ${entryNumber}`);

/** ["Ada"] → "Ada"; ["Ada", "Bea"] → "Ada and Bea"; three → "Ada, Bea and Cleo". */
export function joinNames(names: readonly string[]): string {
  const list = names.map((n) => n.trim()).filter(Boolean);
  if (list.length <= 1) return list[0] ?? '';
  return `${list.slice(0, -1).join(', ')} and ${list[list.length - 1]}`;
}
