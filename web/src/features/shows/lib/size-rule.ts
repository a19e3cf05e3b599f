import { formatInches, parseInches } from '@/lib/inches';
import type { SizeRule } from '../api/types';

export const MM_PER_INCH = 25.4;

/** Millimetres as quilters write inches, to the nearest 1/8: 1536.7 → "60 1/2". */
export const mmToInchText = (mm: number) => formatInches(mm / MM_PER_INCH);

// Sizes are typed to the nearest 1/8 in; a limit is met when a quilt is within half of that of it.
const HALF_EIGHTH = 1 / 16;
const near = (a: number, b: number) => Math.abs(a - b) < HALF_EIGHTH;

export type QuiltSize = { widthIn: number; heightIn: number; perimeterIn: number };

/** Width and height as typed ("60 1/2", "60.5", "60½"), or null until both can be read. */
export function readSize(width: string, height: string): QuiltSize | null {
  const w = parseInches(width);
  const h = parseInches(height);
  if (w === null || h === null || w <= 0 || h <= 0) return null;
  return { widthIn: w, heightIn: h, perimeterIn: 2 * (w + h) };
}

/**
 * What a category's rule says about a quilt, for a warning while she types; null when it fits.
 * The api checks again and has the last word.
 */
export function sizeWarning(rule: SizeRule | undefined, size: QuiltSize | null): string | null {
  if (!rule || !size) return null;
  const f = formatInches;
  if (rule.kind === 'dimensions') {
    const { widthIn: w, heightIn: h } = size;
    const maxW = rule.maxWidthMm != null ? rule.maxWidthMm / MM_PER_INCH : null;
    const minW = rule.minWidthMm != null ? rule.minWidthMm / MM_PER_INCH : null;
    const maxH = rule.maxHeightMm != null ? rule.maxHeightMm / MM_PER_INCH : null;
    const minH = rule.minHeightMm != null ? rule.minHeightMm / MM_PER_INCH : null;
    if (maxW !== null && w > maxW && !near(w, maxW)) return `This category takes quilts at most ${f(maxW)} in wide. Yours is ${f(w - maxW)} in too wide.`;
    if (minW !== null && w < minW && !near(w, minW)) return `This category takes quilts at least ${f(minW)} in wide. Yours is ${f(minW - w)} in too narrow.`;
    if (maxH !== null && h > maxH && !near(h, maxH)) return `This category takes quilts at most ${f(maxH)} in high. Yours is ${f(h - maxH)} in too long.`;
    if (minH !== null && h < minH && !near(h, minH)) return `This category takes quilts at least ${f(minH)} in high. Yours is ${f(minH - h)} in too short.`;
    return null;
  }
  if (rule.kind === 'perimeter') {
    const p = size.perimeterIn;
    if (rule.maxMm != null) {
      const max = rule.maxMm / MM_PER_INCH;
      const over = rule.maxInclusive ? p > max && !near(p, max) : p > max || near(p, max);
      if (over) {
        const by = near(p, max) ? 'exactly on the limit' : `${f(p - max)} in over`;
        return `This category takes quilts ${rule.maxInclusive ? 'at most' : 'less than'} ${f(max)} in around. Yours is ${f(p)} in around, ${by}.`;
      }
    }
    if (rule.minMm != null) {
      const min = rule.minMm / MM_PER_INCH;
      const under = rule.minInclusive ? p < min && !near(p, min) : p < min || near(p, min);
      if (under) {
        const by = near(p, min) ? 'exactly on the limit' : `${f(min - p)} in short`;
        return `This category takes quilts ${rule.minInclusive ? 'at least' : 'more than'} ${f(min)} in around. Yours is ${f(p)} in around, ${by}.`;
      }
    }
  }
  return null;
}
