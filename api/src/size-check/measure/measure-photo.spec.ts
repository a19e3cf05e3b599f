import { renderScene, type SceneSpec } from '../../../scripts/generate-photo-fixtures';
import { measureBlockPhoto, type MeasureResult } from './measure-photo';
import { loadOpenCv } from './opencv';

/** 1/16 inch: half the 1/8 tolerance a guild allows (TRADE.md §1.6). */
const SIXTEENTH_MM = 25.4 / 16;

function scene(overrides: {
  block?: Partial<NonNullable<SceneSpec['block']>> | null;
  card?: Partial<SceneSpec['card']>;
  camera?: Partial<SceneSpec['camera']>;
  background?: SceneSpec['background'];
  expect?: SceneSpec['expect'];
  blockOffFrame?: boolean;
  camouflage?: boolean;
}): SceneSpec {
  return {
    background: overrides.background ?? 'mat',
    block:
      overrides.block === null
        ? null
        : { widthIn: 12.5, heightIn: 12.5, print: 'solid', outOfSquareMm: 0, rotationDeg: 6, threads: 3, ...overrides.block },
    card: { printScale: 1, rotationDeg: -8, side: 'right', framing: 'full', ...overrides.card },
    camera: {
      megapixels: 2.4,
      portrait: false,
      rollDeg: 20,
      tiltDeg: 15,
      tiltAxisDeg: 40,
      barrel: -0.004,
      blurPx: 0.8,
      noise: 3,
      light: 0.2,
      shadow: 0.15,
      exposure: 1,
      jpegQuality: 85,
      fill: 0.85,
      ...overrides.camera,
    },
    blockOffFrame: overrides.blockOffFrame,
    camouflage: overrides.camouflage,
    expect: overrides.expect ?? 'measure',
  };
}

async function measure(spec: SceneSpec, seed: string) {
  const { rgba, width, height, truth } = await renderScene(spec, seed);
  const result = await measureBlockPhoto({ data: rgba, width, height }, { printScale: spec.card.printScale });
  return { result, truth };
}

function expectMeasured(result: MeasureResult): asserts result is Extract<MeasureResult, { ok: true }> {
  if (!result.ok) throw new Error(`refused: ${result.reason}`);
}

describe('measureBlockPhoto on synthetic photos with known truth', () => {
  beforeAll(async () => {
    await loadOpenCv();
  });

  const valid: [string, SceneSpec][] = [
    ['12 1/2 solid on a cutting mat, rolled 20° and tilted 15°', scene({})],
    ['6 1/2 pieced on wood, tilted 22°, card printed at 97%', scene({ background: 'wood', block: { widthIn: 6.5, heightIn: 6.5, print: 'pieced' }, card: { printScale: 0.97, side: 'below' }, camera: { tiltDeg: 22, rollDeg: -25 } })],
    ['12 1/2 x 6 1/2 busy print on white, card at 103%', scene({ background: 'white', block: { widthIn: 12.5, heightIn: 6.5, print: 'busy' }, card: { printScale: 1.03, side: 'left' }, camera: { tiltDeg: 8, rollDeg: 5 } })],
    ['16 1/2 solid on a busy tablecloth, portrait, tilted 25°', scene({ background: 'busy', block: { widthIn: 16.5, heightIn: 16.5 }, card: { side: 'above' }, camera: { portrait: true, tiltDeg: 25, tiltAxisDeg: 200, megapixels: 3 } })],
  ];

  it.each(valid)('%s: width and height within 1/16 inch', async (_name, spec) => {
    const { result, truth } = await measure(spec, 'spec');
    expectMeasured(result);
    expect(Math.abs(result.widthMm - truth.widthMm!)).toBeLessThan(SIXTEENTH_MM);
    expect(Math.abs(result.heightMm - truth.heightMm!)).toBeLessThan(SIXTEENTH_MM);
    expect(result.markersFound).toBe(4);
    expect(result.cornersPx).toHaveLength(4);
    // The block's corners in the photo land where the camera put them (within a few pixels).
    result.cornersPx.forEach(([x, y], i) => {
      expect(Math.hypot(x - truth.cornersPx![i][0], y - truth.cornersPx![i][1])).toBeLessThan(6);
    });
    result.cornerAnglesDeg.forEach((a) => expect(Math.abs(a - 90)).toBeLessThan(1));
    expect(result.homography).toHaveLength(9);
  });

  it('a 9 1/2 block 4 mm out of square: diagonals differ by about what they truly do', async () => {
    const spec = scene({ background: 'wood', block: { widthIn: 9.5, heightIn: 9.5, print: 'pieced', outOfSquareMm: 4, rotationDeg: -5 } });
    const { result, truth } = await measure(spec, 'square');
    expectMeasured(result);
    expect(Math.abs(result.widthMm - truth.widthMm!)).toBeLessThan(SIXTEENTH_MM);
    expect(Math.abs(result.heightMm - truth.heightMm!)).toBeLessThan(SIXTEENTH_MM);
    const measured = Math.abs(result.diagonalsMm[0] - result.diagonalsMm[1]);
    expect(truth.diagonalDifferenceMm!).toBeGreaterThan(5);
    expect(Math.abs(measured - truth.diagonalDifferenceMm!)).toBeLessThan(1);
  });

  const refusals: [string, SceneSpec, string][] = [
    ['no card in the photo', scene({ card: { framing: 'none' }, expect: 'card_not_found' }), 'card_not_found'],
    ['a very dark photo', scene({ camera: { exposure: 0.1 }, expect: 'too_dark' }), 'too_dark'],
    ['the block cut off by the frame', scene({ blockOffFrame: true, card: { side: 'left' }, expect: 'block_touches_edge' }), 'block_touches_edge'],
    ['a block the colour of the table', scene({ background: 'white', block: { threads: 0 }, camouflage: true, expect: 'low_contrast' }), 'low_contrast'],
  ];

  it.each(refusals)('%s is refused with a reason and plain advice', async (_name, spec, reason) => {
    const { result } = await measure(spec, 'refuse');
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.reason).toBe(reason);
    expect(result.message).toMatch(/photo/);
  });

  it('frees its memory: repeated calls do not grow the WebAssembly heap', async () => {
    const cv: any = await loadOpenCv();
    const spec = scene({ block: { widthIn: 6.5, heightIn: 6.5 }, camera: { megapixels: 0.8 } });
    const { rgba, width, height } = await renderScene(spec, 'leak');
    const image = { data: rgba, width, height };
    for (let i = 0; i < 3; i++) expectMeasured(await measureBlockPhoto(image));
    const before = cv.HEAP8.length;
    for (let i = 0; i < 25; i++) await measureBlockPhoto(image);
    expect(cv.HEAP8.length).toBe(before);
  });
});
