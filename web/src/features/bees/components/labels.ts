import type { Handover, MyBeeStatus } from '../api/get-bees';

export const HANDOVER_LABELS: Record<Handover, string> = {
  mail: 'By mail',
  meeting: 'At guild meetings',
};

export const HANDOVER_OPTIONS = [
  { value: 'mail', label: 'By mail: makers post their blocks to the queen' },
  { value: 'meeting', label: 'At meetings: makers bring their blocks to the queen' },
] as const;

export function handoverLabel(handover: string): string {
  return HANDOVER_LABELS[handover as Handover] ?? handover;
}

export function myStatusLabel(status: MyBeeStatus | undefined): string {
  switch (status) {
    case 'organiser':
      return 'You organise this bee';
    case 'active':
      return 'You are a maker';
    case 'invited':
      return 'You are invited';
    default:
      return 'You are not in this bee';
  }
}

export function memberStatusLabel(status: string): string {
  switch (status) {
    case 'organiser':
      return 'Organiser';
    case 'active':
      return 'Maker';
    case 'invited':
      return 'Invited, has not joined yet';
    case 'left':
      return 'Has left';
    default:
      return status;
  }
}
