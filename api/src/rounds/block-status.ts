import type { BlockStatus } from './round-block.entity';

/** A block is on its way or home once mailed, handed over or received. */
export const BLOCK_ON_ITS_WAY: readonly BlockStatus[] = ['mailed', 'handed_over', 'received'];

/** Late: the due date (a local "YYYY-MM-DD") has passed and the block is not on its way. */
export function isLate(status: BlockStatus, dueDate: string, today: string): boolean {
  return !BLOCK_ON_ITS_WAY.includes(status) && today > dueDate;
}
