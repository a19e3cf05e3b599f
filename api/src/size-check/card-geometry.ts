/**
 * The reference card, in millimetres on the card's own plane (x to the right, y down, origin at the
 * card's top-left corner). The PDF draws it from these numbers and the measurement maps photos back
 * onto them, so they are the one source of truth for both. The same card serves US Letter and A4.
 */
export const CARD = {
  widthMm: 180,
  heightMm: 120,
  /** ArUco markers from OpenCV's predefined 4x4 dictionary with 50 ids. */
  dictionary: 'DICT_4X4_50' as const,
  markerSizeMm: 22,
  /** Each marker's top-left corner; ids 0–3 clockwise from the top-left. */
  markers: [
    { id: 0, x: 6, y: 6 },
    { id: 1, x: 152, y: 6 },
    { id: 2, x: 152, y: 92 },
    { id: 3, x: 6, y: 92 },
  ],
  /** The test square, 1 inch a side (TRADE.md §2.2). */
  testSquare: { x: 36, y: 8, sizeMm: 25.4 },
  /** Long ruler bars the maker checks with her own ruler: 6 inches and 15 cm, between the marker rows. */
  inchBar: { x: 14, y: 44, lengthMm: 6 * 25.4, label: '6 inches' },
  cmBar: { x: 14, y: 66, lengthMm: 150, label: '15 cm' },
};

/** The four corners of a marker in card millimetres, in ArUco's order: TL, TR, BR, BL. */
export function markerCorners(id: number): [number, number][] {
  const m = CARD.markers.find((marker) => marker.id === id);
  if (!m) throw new Error(`marker ${id} is not on the card`);
  const s = CARD.markerSizeMm;
  return [
    [m.x, m.y],
    [m.x + s, m.y],
    [m.x + s, m.y + s],
    [m.x, m.y + s],
  ];
}

/**
 * How much bigger (>1) or smaller (<1) the card came out of the printer, from what the maker's ruler
 * reads for a bar. Refused beyond 3% (TRADE.md §2.2: print at 100%, no "fit to page").
 */
export const MAX_PRINT_SCALE_ERROR = 0.03;

export function printScale(nominalMm: number, readMm: number): number {
  return readMm / nominalMm;
}

export function printScaleProblem(scale: number): string | null {
  if (!Number.isFinite(scale) || scale <= 0) return 'Enter what your ruler reads for the long bar.';
  // A hair of slack so that exactly 3% (a reading of 103%) is still accepted despite rounding.
  if (Math.abs(scale - 1) > MAX_PRINT_SCALE_ERROR + 1e-9) {
    const percent = Math.round(scale * 1000) / 10;
    return (
      `Your card printed at about ${percent}% of its true size, more than 3% off. ` +
      'Print it again at 100% ("actual size"), with "fit to page" or "shrink to fit" turned off, and measure the bar again.'
    );
  }
  return null;
}
