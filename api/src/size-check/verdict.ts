import { formatInches, mmToInches } from '../common/units/inches';

export type VerdictKind = 'in_size' | 'too_big' | 'too_small' | 'big_enough';

export interface VerdictInput {
  measured: { widthMm: number; heightMm: number; diagonalsMm?: [number, number] };
  finished: { widthMm: number; heightMm: number };
  seamAllowanceMm: number;
  toleranceMm: number;
  trimMode: 'trim' | 'untrimmed';
}

export interface SideCheck {
  measuredMm: number;
  targetMm: number;
  /** measured − target; positive means bigger than asked. */
  differenceMm: number;
  status: 'ok' | 'big' | 'small';
}

export interface Verdict {
  kind: VerdictKind;
  outOfSquare: boolean;
  diagonalDifferenceMm: number | null;
  width: SideCheck;
  height: SideCheck;
  /** One plain sentence for the maker, sizes to 1/16 inch, saying finished or unfinished. */
  summary: string;
}

const inch = (mm: number) => formatInches(mmToInches(Math.abs(mm)), 16);

/**
 * Compares a measured block with the round's target: its unfinished size (finished plus two seam
 * allowances, TRADE.md §1.1) within the tolerance (1/8 inch by default — common practice, S14).
 * A block may lie either way round, so the longer measured side is compared with the longer target.
 */
export function judgeBlock(input: VerdictInput): Verdict {
  const seams = 2 * input.seamAllowanceMm;
  const target = { w: input.finished.widthMm + seams, h: input.finished.heightMm + seams };
  const m = input.measured;
  const targetWide = target.w >= target.h;
  const measuredWide = m.widthMm >= m.heightMm;
  const [mw, mh] = targetWide === measuredWide ? [m.widthMm, m.heightMm] : [m.heightMm, m.widthMm];
  const tol = input.toleranceMm;
  const side = (measuredMm: number, targetMm: number): SideCheck => {
    const differenceMm = measuredMm - targetMm;
    const status =
      input.trimMode === 'untrimmed'
        ? differenceMm < -tol
          ? 'small'
          : 'ok'
        : differenceMm > tol
          ? 'big'
          : differenceMm < -tol
            ? 'small'
            : 'ok';
    return { measuredMm, targetMm, differenceMm, status };
  };
  const width = side(mw, target.w);
  const height = side(mh, target.h);
  const diagonalDifferenceMm = m.diagonalsMm ? Math.abs(m.diagonalsMm[0] - m.diagonalsMm[1]) : null;
  // Out of square when the diagonals differ by more than the tolerance: common practice, no source
  // (equal diagonals mean square, TRADE.md §1.9, S25).
  const outOfSquare = diagonalDifferenceMm !== null && diagonalDifferenceMm > tol;

  const sides = [width, height];
  const unfinishedText = `${inch(target.w)} x ${inch(target.h)} inches unfinished`;
  let kind: VerdictKind;
  let summary: string;
  if (sides.some((s) => s.status === 'small')) {
    kind = 'too_small';
    const worst = sides.reduce((a, b) => (a.differenceMm < b.differenceMm ? a : b));
    summary = `Too small by ${inch(worst.differenceMm)}: the block should be ${unfinishedText}.`;
  } else if (sides.some((s) => s.status === 'big')) {
    kind = 'too_big';
    const worst = sides.reduce((a, b) => (a.differenceMm > b.differenceMm ? a : b));
    summary = `Too big by ${inch(worst.differenceMm)}: trim it to ${unfinishedText}.`;
  } else if (input.trimMode === 'untrimmed') {
    kind = 'big_enough';
    summary = `Big enough: the queen will trim it to ${unfinishedText}.`;
  } else {
    kind = 'in_size';
    summary = `In size: ${unfinishedText}, within ${inch(tol)} inch.`;
  }
  if (outOfSquare) summary += ` Out of square: the diagonals differ by ${inch(diagonalDifferenceMm!)} inch.`;
  return { kind, outOfSquare, diagonalDifferenceMm, width, height, summary };
}
