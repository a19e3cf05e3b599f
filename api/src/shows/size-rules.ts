import { formatInches, MM_PER_INCH, mmToInches } from '../common/units/inches';

/**
 * A category's size rule, in millimetres as stored. Quilts are measured as they hang: width across,
 * height (drop) down, so a width limit is never checked against the height.
 */
export type SizeRule =
  | { kind: 'none' }
  | { kind: 'dimensions'; minWidthMm: number | null; maxWidthMm: number | null; minHeightMm: number | null; maxHeightMm: number | null }
  | { kind: 'perimeter'; minMm: number | null; minInclusive: boolean; maxMm: number | null; maxInclusive: boolean };

export interface SizeProblem {
  /** The form field the problem belongs to. */
  field: 'widthIn' | 'heightIn';
  message: string;
}

/** Perimeter of a width x height quilt, in millimetres. */
export function perimeterMm(widthMm: number, heightMm: number): number {
  return 2 * (widthMm + heightMm);
}

const inch = (mm: number) => formatInches(mmToInches(mm), 8);
// Sizes are entered to the nearest 1/8 inch; compare at that grain so 60 1/8 typed never reads as 60.12499.
const EIGHTH_MM = MM_PER_INCH / 8;
const near = (a: number, b: number) => Math.abs(a - b) < EIGHTH_MM / 2;

/**
 * Checks a quilt against its category's rule. Returns the first rule broken, saying which and by how
 * much ("… at most 240 in around; yours is 252 in, 12 in over"), or null when it fits.
 */
export function checkSize(rule: SizeRule, widthMm: number, heightMm: number): SizeProblem | null {
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
    const p = perimeterMm(widthMm, heightMm);
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
    return null;
  }
  return null;
}

/** The rule in words, for the category list and the entry form. */
export function sizeRuleText(rule: SizeRule): string {
  if (rule.kind === 'dimensions') {
    const parts: string[] = [];
    const range = (min: number | null, max: number | null, what: string) => {
      if (min != null && max != null) parts.push(`${inch(min)} to ${inch(max)} in ${what}`);
      else if (max != null) parts.push(`at most ${inch(max)} in ${what}`);
      else if (min != null) parts.push(`at least ${inch(min)} in ${what}`);
    };
    range(rule.minWidthMm, rule.maxWidthMm, 'wide');
    range(rule.minHeightMm, rule.maxHeightMm, 'high');
    return parts.length ? `Quilts ${parts.join(' and ')}` : 'Any size';
  }
  if (rule.kind === 'perimeter') {
    const parts: string[] = [];
    if (rule.minMm != null) parts.push(`${rule.minInclusive ? 'at least' : 'more than'} ${inch(rule.minMm)} in`);
    if (rule.maxMm != null) parts.push(`${rule.maxInclusive ? 'at most' : 'less than'} ${inch(rule.maxMm)} in`);
    return parts.length ? `Perimeter ${parts.join(' and ')}` : 'Any size';
  }
  return 'Any size';
}

/**
 * The usual perimeter bands, in inches (TRADE.md §6.2, S84): small < 160, medium 160–240, large
 * 241–320, extra large > 320. The published bands say nothing about a perimeter between 240 and 241
 * (quilts are measured to fractions of an inch). Our closed rule: medium ends at 240 inclusive and
 * large begins just above it ("more than 240"), so every perimeter falls in exactly one band.
 */
export const USUAL_PERIMETER_BANDS = [
  { name: 'Small', maxIn: 160, maxInclusive: false },
  { name: 'Medium', minIn: 160, minInclusive: true, maxIn: 240, maxInclusive: true },
  { name: 'Large', minIn: 240, minInclusive: false, maxIn: 320, maxInclusive: true },
  { name: 'Extra large', minIn: 320, minInclusive: false },
] as const;
