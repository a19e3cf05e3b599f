import type { EntityManager } from '@mikro-orm/mariadb';
import { formatInches, mmToInches } from '../common/units/inches';
import type { RoundBlock } from '../rounds/round-block.entity';
import { SizeCheck } from './size-check.entity';

/** Measurements of a photo are shown to 1/16 inch (DESIGN.md §4). */
const sixteenth = (mm: number | null | undefined) => (mm == null ? null : formatInches(mmToInches(mm), 16));

export function presentSizeCheck(c: SizeCheck, guildId: number) {

  const img = (kind: string) => (c.images && (c.images as Record<string, string>)[kind] ? `/api/guilds/${guildId}/size-checks/${c.id}/images/${kind}` : null);
  return {
    id: c.id,
    status: c.status,
    failureReason: c.failureReason ?? null,
    message: c.message ?? null,
    verdict: c.verdict ?? null,
    outOfSquare: c.outOfSquare ?? null,
    summary: c.summary ?? null,
    measured: c.widthMm != null ? { widthMm: c.widthMm, heightMm: c.heightMm, widthText: sixteenth(c.widthMm), heightText: sixteenth(c.heightMm) } : null,
    manual: c.manualWidthMm != null ? { widthMm: c.manualWidthMm, heightMm: c.manualHeightMm, widthText: sixteenth(c.manualWidthMm), heightText: sixteenth(c.manualHeightMm) } : null,
    diagonalsMm: c.diagonalsMm ?? null,
    cornerAnglesDeg: c.cornerAnglesDeg ?? null,
    printScale: c.printScale ?? null,
    rulerReadingText: c.rulerReadingMm != null ? formatInches(mmToInches(c.rulerReadingMm), 16) : null,
    onBehalf: c.onBehalf,
    createdAt: c.createdAt,
    processingMs: c.processingMs ?? null,
    images: { display: img('display'), thumb: img('thumb'), overlay: img('overlay'), original: img('original') },
  };
  }

export type PresentedSizeCheck = ReturnType<typeof presentSizeCheck>;

/** The latest check of each block, for the round page and the queen's grid. */
export async function latestSizeChecks(em: EntityManager, blocks: RoundBlock[], guildId: number): Promise<Map<number, PresentedSizeCheck>> {
  const latest = new Map<number, PresentedSizeCheck>();
  if (!blocks.length) return latest;
  const checks = await em.find(SizeCheck, { block: { $in: blocks.map((b) => b.id) } }, { orderBy: { createdAt: 'asc', id: 'asc' } });
  for (const c of checks) latest.set(c.block.id, presentSizeCheck(c, guildId));
  return latest;
}
