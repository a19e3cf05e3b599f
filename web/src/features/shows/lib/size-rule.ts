import { formatInches, inchesOrNull, inchesToStoredMm } from '@/lib/inches';
import type { Category, SizeRule } from '../api/types';

export const MM_PER_INCH = 25.4;

/** Millimetres as quilters write inches, to the nearest 1/8: 1536.7 → "60 1/2". */
export const mmToInchText = (mm: number) => formatInches(Number((mm / MM_PER_INCH).toPrecision(12)));

// Sizes are entered to the nearest 1/8 inch; the api compares at that grain, in stored millimetres.
const EIGHTH_MM = MM_PER_INCH / 8;
const near = (a: number, b: number) => Math.abs(a - b) < EIGHTH_MM / 2;

export type QuiltSize = { widthIn: number; heightIn: number; perimeterIn: number };

/** Width and height as typed ("60 1/2", "60.5", "60½"), or null until the api could read both. */
export function readSize(width: string, height: string): QuiltSize | null {
  const w = inchesOrNull(width);
  const h = inchesOrNull(height);
  if (w === null || h === null || w <= 0 || h <= 0) return null;
  return { widthIn: w, heightIn: h, perimeterIn: 2 * (w + h) };
}

/** The field a size problem belongs to, as the api names it. */
export type SizeProblem = { field: 'widthIn' | 'heightIn'; message: string };

/**
 * The first limit of a category's rule the quilt breaks, in the api's words, or null when it fits.
 * A copy of the api's check (same millimetres, same rounding), because the api refuses such a quilt.
 */
export function sizeProblemMm(rule: SizeRule | undefined, widthMm: number, heightMm: number): SizeProblem | null {
  if (!rule) return null;
  const inch = mmToInchText;
  if (rule.kind === 'dimensions') {
    if (rule.maxWidthMm != null && widthMm > rule.maxWidthMm && !near(widthMm, rule.maxWidthMm))
      return { field: 'widthIn', message: `This category takes quilts at most ${inch(rule.maxWidthMm)} in wide; yours is ${inch(widthMm)} in, ${inch(widthMm - rule.maxWidthMm)} in too wide.` };
    if (rule.minWidthMm != null && widthMm < rule.minWidthMm && !near(widthMm, rule.minWidthMm))
      return { field: 'widthIn', message: `This category takes quilts at least ${inch(rule.minWidthMm)} in wide; yours is ${inch(widthMm)} in, ${inch(rule.minWidthMm - widthMm)} in too narrow.` };
    if (rule.maxHeightMm != null && heightMm > rule.maxHeightMm && !near(heightMm, rule.maxHeightMm))
      return { field: 'heightIn', message: `This category takes quilts at most ${inch(rule.maxHeightMm)} in high; yours is ${inch(heightMm)} in, ${inch(heightMm - rule.maxHeightMm)} in too long.` };
    if (rule.minHeightMm != null && heightMm < rule.minHeightMm && !near(heightMm, rule.minHeightMm))
      return { field: 'heightIn', message: `This category takes quilts at least ${inch(rule.minHeightMm)} in high; yours is ${inch(heightMm)} in, ${inch(rule.minHeightMm - heightMm)} in too short.` };
    return null;
  }
  if (rule.kind === 'perimeter') {
    const p = 2 * (widthMm + heightMm);
    const yours = `yours is ${inch(p)} in around`;
    if (rule.maxMm != null) {
      const over = rule.maxInclusive ? p > rule.maxMm && !near(p, rule.maxMm) : p > rule.maxMm || near(p, rule.maxMm);
      if (over) {
        const by = near(p, rule.maxMm) ? 'exactly on the limit' : `${inch(p - rule.maxMm)} in over`;
        return { field: 'widthIn', message: `This category takes quilts ${rule.maxInclusive ? 'at most' : 'less than'} ${inch(rule.maxMm)} in around (perimeter); ${yours}, ${by}.` };
      }
    }
    if (rule.minMm != null) {
      const under = rule.minInclusive ? p < rule.minMm && !near(p, rule.minMm) : p < rule.minMm || near(p, rule.minMm);
      if (under) {
        const by = near(p, rule.minMm) ? 'exactly on the limit' : `${inch(rule.minMm - p)} in short`;
        return { field: 'widthIn', message: `This category takes quilts ${rule.minInclusive ? 'at least' : 'more than'} ${inch(rule.minMm)} in around (perimeter); ${yours}, ${by}.` };
      }
    }
  }
  return null;
}

/** The same check for a size as she typed it; null while the size cannot be read. */
export function sizeProblem(rule: SizeRule | undefined, size: QuiltSize | null): SizeProblem | null {
  if (!size) return null;
  return sizeProblemMm(rule, inchesToStoredMm(size.widthIn), inchesToStoredMm(size.heightIn));
}

/**
 * Names as the api keeps them: trimmed, inner spaces closed up, empty lines and repeats (ignoring
 * case) left out. The api counts makers after this, so "Ann" twice is one maker.
 */
export function cleanMakers(makers: readonly (string | null | undefined)[]): string[] {
  const seen = new Set<string>();
  const out: string[] = [];
  for (const name of makers.map((m) => (m ?? '').trim().replace(/\s+/g, ' ')).filter(Boolean)) {
    if (seen.has(name.toLowerCase())) continue;
    seen.add(name.toLowerCase());
    out.push(name);
  }
  return out;
}

/** The api's refusal of too few makers for a group category, or null. */
export function makersProblem(category: Pick<Category, 'name' | 'minMakers'> | undefined, makerCount: number): string | null {
  if (!category || category.minMakers == null || makerCount >= category.minMakers) return null;
  return `${category.name} is for quilts made by ${category.minMakers} or more people; this one names ${makerCount}.`;
}
