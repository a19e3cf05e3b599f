import { formatInches } from '../common/units/inches';

/** The show's hanging-sleeve rule, in inches. */
export interface SleeveRule {
  /** Finished sleeve depth for most quilts (4 in is usual, TRADE.md §6.3). */
  depthIn: number;
  /** Quilts narrower than this use `narrowDepthIn` (30 → 3 in, TRADE.md §6.3, S54). */
  narrowUnderIn: number | null;
  narrowDepthIn: number | null;
  /** Quilts wider than this hang from a split sleeve (over 90 in, S54). */
  splitOverIn: number | null;
}

export const DEFAULT_SLEEVE: SleeveRule = { depthIn: 4, narrowUnderIn: 30, narrowDepthIn: 3, splitOverIn: 90 };

export interface SleeveCut {
  depthIn: number;
  /** The strip folds in half lengthwise with a 1/4 in seam: twice the depth plus 1/2 (4 in → 8 1/2, S54). */
  stripWidthIn: number;
  /** Quilt width less 1 in (S54), or for a split sleeve each half's share (see below). */
  stripLengthIn: number;
  pieces: 1 | 2;
  text: string;
}

/**
 * What an entrant cuts for her sleeve. TRADE.md §3.8 (S54): a 4 in sleeve from an 8 1/2 in strip,
 * width − 1 long (a 60 in quilt: 8 1/2 x 59). A split sleeve is two pieces each half the width less
 * 1 in, leaving a gap in the middle for the stand's centre support (common practice).
 */
export function sleeveFor(widthIn: number, rule: SleeveRule = DEFAULT_SLEEVE): SleeveCut {
  const narrow = rule.narrowUnderIn != null && rule.narrowDepthIn != null && widthIn < rule.narrowUnderIn;
  const depthIn = narrow ? rule.narrowDepthIn! : rule.depthIn;
  const stripWidthIn = depthIn * 2 + 0.5;
  const split = rule.splitOverIn != null && widthIn > rule.splitOverIn;
  const stripLengthIn = split ? widthIn / 2 - 1 : Math.max(widthIn - 1, 0);
  const f = (n: number) => formatInches(n, 8);
  const text = split
    ? `A ${f(depthIn)} in split sleeve: cut two strips ${f(stripWidthIn)} in x ${f(stripLengthIn)} in and leave a gap in the middle.`
    : `A ${f(depthIn)} in sleeve: cut a strip ${f(stripWidthIn)} in x ${f(stripLengthIn)} in.`;
  return { depthIn, stripWidthIn, stripLengthIn, pieces: split ? 2 : 1, text };
}

/** The rule in words for entrants. */
export function sleeveRuleText(rule: SleeveRule): string {
  const f = (n: number) => formatInches(n, 8);
  const parts = [`Every quilt needs a ${f(rule.depthIn)} in hanging sleeve sewn to the top of the back`];
  if (rule.narrowUnderIn != null && rule.narrowDepthIn != null) parts.push(`quilts under ${f(rule.narrowUnderIn)} in wide may use a ${f(rule.narrowDepthIn)} in sleeve`);
  if (rule.splitOverIn != null) parts.push(`quilts over ${f(rule.splitOverIn)} in wide need a split sleeve`);
  return `${parts.join('; ')}. Cut the strip twice the sleeve's depth plus 1/2 in wide and the quilt's width less 1 in long.`;
}
