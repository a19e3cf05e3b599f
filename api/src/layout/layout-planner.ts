/** Quilt arithmetic for laying out a guild's blocks. Every length is in inches. */

/** Thrown for inputs that cannot describe a quilt; the message can be shown as it is. */
export class LayoutError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'LayoutError';
  }
}

export const MAX_BLOCK_COUNT = 2000;

function assertPositive(value: number, what: string): void {
  if (!Number.isFinite(value) || value <= 0) throw new LayoutError(`The ${what} must be a number of inches more than 0.`);
}

function assertNotNegative(value: number, what: string): void {
  if (!Number.isFinite(value) || value < 0) throw new LayoutError(`The ${what} must be a number of inches, 0 or more.`);
}

function assertCount(value: number, what: string): void {
  if (!Number.isInteger(value) || value < 1 || value > MAX_BLOCK_COUNT) {
    throw new LayoutError(`The number of ${what} must be a whole number from 1 to ${MAX_BLOCK_COUNT}.`);
  }
}

// Division results such as 424 / 40 carry float noise; a part-millionth is never a real piece.
function ceilClean(value: number): number {
  return Math.ceil(value - 1e-9);
}

export interface Arrangement {
  rows: number;
  columns: number;
  used: number;
  leftover: number;
}

/** Columns : rows of a portrait bed quilt (common practice). */
const PORTRAIT_RATIO = 4 / 5;
/** Taller than twice as long as wide is a runner, not a bed quilt (common practice); tiny counts excepted. */
const MAX_ROWS_PER_COLUMN = 2;
const MAX_ARRANGEMENTS = 6;

/** Grid layouts for a pile of blocks, best first: fewest left over, then nearest a 4:5 portrait. */
export function arrangements(blockCount: number): Arrangement[] {
  assertCount(blockCount, 'blocks');
  const options: Arrangement[] = [];
  // rows ≥ columns, so columns never exceed the square root.
  for (let columns = 1; columns * columns <= blockCount; columns++) {
    const rows = Math.min(Math.floor(blockCount / columns), Math.max(MAX_ROWS_PER_COLUMN * columns, 3));
    const used = rows * columns;
    options.push({ rows, columns, used, leftover: blockCount - used });
  }
  return options.sort(byLeftoverThenShape).slice(0, MAX_ARRANGEMENTS);
}

function byLeftoverThenShape(a: Arrangement, b: Arrangement): number {
  return a.leftover - b.leftover || distanceFromPortrait(a) - distanceFromPortrait(b) || a.columns - b.columns;
}

// Logarithmic, so 2:5 and 8:5 count as equally far from 4:5.
function distanceFromPortrait({ rows, columns }: Arrangement): number {
  return Math.abs(Math.log(columns / rows / PORTRAIT_RATIO));
}

export interface Size {
  width: number;
  height: number;
}

export interface GridInput {
  rows: number;
  columns: number;
  blockWidth: number;
  blockHeight: number;
  sashing?: number;
  /** Sashing also runs round the outside of the block grid, not only between blocks. */
  sashingAround?: boolean;
  /** Border widths, innermost first. */
  borders?: readonly number[];
}

function validateGrid(input: GridInput): void {
  assertCount(input.rows, 'rows');
  assertCount(input.columns, 'columns');
  if (input.rows * input.columns > MAX_BLOCK_COUNT) throw new LayoutError(`A quilt can have at most ${MAX_BLOCK_COUNT} blocks.`);
  assertPositive(input.blockWidth, 'block width');
  assertPositive(input.blockHeight, 'block height');
  assertNotNegative(input.sashing ?? 0, 'sashing width');
  (input.borders ?? []).forEach((border, index) => assertPositive(border, `width of border ${index + 1}`));
}

/** Finished top size (TRADE.md §3.3): blocks, sashing between them (and round them), and two of each border. */
export function topSize(input: GridInput): Size {
  validateGrid(input);
  const sashing = input.sashing ?? 0;
  const sashingLines = (count: number) => (input.sashingAround ? count + 1 : count - 1);
  const bordersBothSides = 2 * (input.borders ?? []).reduce((sum, border) => sum + border, 0);
  return {
    width: input.columns * input.blockWidth + sashingLines(input.columns) * sashing + bordersBothSides,
    height: input.rows * input.blockHeight + sashingLines(input.rows) * sashing + bordersBothSides,
  };
}

export interface SashingInput {
  rows: number;
  columns: number;
  sashingAround: boolean;
  cornerstones: boolean;
}

export interface SashingPieces {
  /** All strips: shortStrips + longStrips. */
  strips: number;
  /** Strips one block long. */
  shortStrips: number;
  /** Strips running the full width of the block grid, between (and with sashingAround, above and below) rows. */
  longStrips: number;
  cornerstones: number;
  /** A sentence for the cutting list. */
  description: string;
}

/** Pieces to cut for sashing (TRADE.md §3.4, S46); without cornerstones, rows are joined by long strips. */
export function sashingPieces(input: SashingInput): SashingPieces {
  assertCount(input.rows, 'rows');
  assertCount(input.columns, 'columns');
  const { rows, columns } = input;
  const lines = (count: number) => (input.sashingAround ? count + 1 : count - 1);
  if (input.cornerstones) {
    const shortStrips = lines(rows) * columns + lines(columns) * rows;
    const cornerstones = lines(rows) * lines(columns);
    const description = `${plural(shortStrips, 'block-length strip')} and ${plural(cornerstones, 'cornerstone')}.`;
    return { strips: shortStrips, shortStrips, longStrips: 0, cornerstones, description };
  }
  const shortStrips = rows * lines(columns);
  const longStrips = lines(rows);
  const description =
    `${plural(shortStrips, 'block-length strip')} between blocks in a row and ` +
    `${plural(longStrips, 'long strip')} the full width of the blocks, no cornerstones.`;
  return { strips: shortStrips + longStrips, shortStrips, longStrips, cornerstones: 0, description };
}

function plural(count: number, noun: string): string {
  return `${count} ${noun}${count === 1 ? '' : 's'}`;
}

export interface BindingInput extends Size {
  stripWidth?: number;
  usableWidth?: number;
  /** For the corners and joining the ends (TRADE.md §3.6, S49). */
  extra?: number;
}

export interface Binding {
  length: number;
  strips: number;
  /** Length of fabric, selvage to selvage cuts stacked, in inches. */
  fabric: number;
}

/** Binding strips cut across the fabric's usable width (TRADE.md §3.6, S49, S51). */
export function binding(input: BindingInput): Binding {
  const { stripWidth = 2.5, usableWidth = 40, extra = 12 } = input;
  assertPositive(input.width, 'quilt width');
  assertPositive(input.height, 'quilt height');
  assertPositive(stripWidth, 'binding strip width');
  assertPositive(usableWidth, 'usable fabric width');
  assertNotNegative(extra, 'extra binding length');
  const length = 2 * (input.width + input.height) + extra;
  const strips = ceilClean(length / usableWidth);
  return { length, strips, fabric: strips * stripWidth };
}

export interface BackingInput extends Size {
  /** Extra on every side for the quilter's frame (TRADE.md §3.7, S52, S53). */
  margin?: number;
  usableWidth?: number;
}

export type BackingSeams = 'vertical' | 'horizontal' | 'none';

export interface Backing extends Size {
  pieces: number;
  /** Each piece is cut this long, selvage to selvage across its width. */
  pieceLength: number;
  seams: BackingSeams;
  /** Total length of fabric off the bolt. */
  fabricLength: number;
  /** fabricLength in yards, rounded up to the next 1/8 yard as shops cut it (common practice). */
  yardage: number;
}

const INCHES_PER_YARD = 36; // TRADE.md §3.5, S47

/** Backing pieced from widths of fabric, seamed whichever way uses less fabric (vertical on a tie). */
export function backing(input: BackingInput): Backing {
  const { margin = 4, usableWidth = 40 } = input;
  assertPositive(input.width, 'quilt width');
  assertPositive(input.height, 'quilt height');
  assertNotNegative(margin, 'backing margin');
  assertPositive(usableWidth, 'usable fabric width');
  const width = input.width + 2 * margin;
  const height = input.height + 2 * margin;
  // Vertical seams: pieces run the length of the quilt, side by side; horizontal: across, stacked.
  const verticalPieces = ceilClean(width / usableWidth);
  const horizontalPieces = ceilClean(height / usableWidth);
  const vertical = verticalPieces * height <= horizontalPieces * width;
  const pieces = vertical ? verticalPieces : horizontalPieces;
  const pieceLength = vertical ? height : width;
  const fabricLength = pieces * pieceLength;
  const seams: BackingSeams = pieces === 1 ? 'none' : vertical ? 'vertical' : 'horizontal';
  return { width, height, pieces, pieceLength, seams, fabricLength, yardage: ceilClean((fabricLength / INCHES_PER_YARD) * 8) / 8 };
}

/** Batting larger than the top on every side; the margin is a setting because longarm quilters differ (TRADE.md §3.7, S53). */
export function batting(input: Size & { margin?: number }): Size {
  const { margin = 4 } = input;
  assertPositive(input.width, 'quilt width');
  assertPositive(input.height, 'quilt height');
  assertNotNegative(margin, 'batting margin');
  return { width: input.width + 2 * margin, height: input.height + 2 * margin };
}

export type BedName = 'crib' | 'twin' | 'twin-xl' | 'full' | 'queen' | 'king' | 'california-king';

export interface Mattress {
  bed: BedName;
  label: string;
  width: number;
  length: number;
}

/** Mattress tops in inches (TRADE.md §3.1, S41); charts disagree by an inch or two (S44). */
export const MATTRESSES: readonly Mattress[] = [
  { bed: 'crib', label: 'Crib', width: 28, length: 52 },
  { bed: 'twin', label: 'Twin', width: 39, length: 75 },
  { bed: 'twin-xl', label: 'Twin XL', width: 39, length: 80 },
  { bed: 'full', label: 'Full', width: 54, length: 75 },
  { bed: 'queen', label: 'Queen', width: 60, length: 80 },
  { bed: 'king', label: 'King', width: 76, length: 80 },
  { bed: 'california-king', label: 'California king', width: 72, length: 84 },
];

export interface BedFit {
  bed: BedName;
  label: string;
  covers: boolean;
  /** What hangs over each side; negative when the quilt is narrower than the mattress. */
  sideDrop: number;
  /** What hangs over the foot, with the head edge at the top of the mattress and no pillow tuck. */
  footDrop: number;
}

/** Which mattresses the quilt covers; the drops let a person judge whether it hangs far enough. */
export function bedsCovered(size: Size): BedFit[] {
  assertPositive(size.width, 'quilt width');
  assertPositive(size.height, 'quilt height');
  return MATTRESSES.map(({ bed, label, width, length }) => {
    const sideDrop = (size.width - width) / 2;
    const footDrop = size.height - length;
    return { bed, label, covers: sideDrop >= 0 && footDrop >= 0, sideDrop, footDrop };
  });
}

export interface LayoutInput extends GridInput {
  cornerstones?: boolean;
  bindingStripWidth?: number;
  bindingExtra?: number;
  usableWidth?: number;
  backingMargin?: number;
  battingMargin?: number;
}

export interface LayoutPlan {
  rows: number;
  columns: number;
  blockCount: number;
  blockWidth: number;
  blockHeight: number;
  sashing: number;
  sashingAround: boolean;
  /** False whenever there is no sashing. */
  cornerstones: boolean;
  borders: number[];
  top: Size;
  /** Null when there is no sashing. */
  sashingPieces: SashingPieces | null;
  binding: Binding;
  backing: Backing;
  batting: Size;
  beds: BedFit[];
}

/** Everything a layout page shows for one arrangement of blocks. */
export function planLayout(input: LayoutInput): LayoutPlan {
  const top = topSize(input);
  const sashing = input.sashing ?? 0;
  const sashingAround = sashing > 0 && (input.sashingAround ?? false);
  const cornerstones = sashing > 0 && (input.cornerstones ?? false);
  return {
    rows: input.rows,
    columns: input.columns,
    blockCount: input.rows * input.columns,
    blockWidth: input.blockWidth,
    blockHeight: input.blockHeight,
    sashing,
    sashingAround,
    cornerstones,
    borders: [...(input.borders ?? [])],
    top,
    sashingPieces: sashing > 0 ? sashingPieces({ rows: input.rows, columns: input.columns, sashingAround, cornerstones }) : null,
    binding: binding({ ...top, stripWidth: input.bindingStripWidth, usableWidth: input.usableWidth, extra: input.bindingExtra }),
    backing: backing({ ...top, margin: input.backingMargin, usableWidth: input.usableWidth }),
    batting: batting({ ...top, margin: input.battingMargin }),
    beds: bedsCovered(top),
  };
}
