import { inchesToMm } from '../common/units/inches';
import { checkSize, perimeterMm, type SizeRule, sizeRuleText, USUAL_PERIMETER_BANDS } from './size-rules';

const mm = inchesToMm;
const bandRule = (b: (typeof USUAL_PERIMETER_BANDS)[number]): SizeRule => ({
  kind: 'perimeter',
  minMm: 'minIn' in b ? mm(b.minIn) : null,
  minInclusive: 'minInclusive' in b ? b.minInclusive : true,
  maxMm: 'maxIn' in b ? mm(b.maxIn) : null,
  maxInclusive: 'maxInclusive' in b ? b.maxInclusive : true,
});
const bandsOf = (perimeterIn: number) =>
  USUAL_PERIMETER_BANDS.filter((b) => checkSize(bandRule(b), mm(perimeterIn / 4), mm(perimeterIn / 4)) === null).map((b) => b.name);

describe('perimeter bands (TRADE.md §6.2, S84: small < 160, medium 160–240, large 241–320, XL > 320)', () => {
  it.each([
    [100, 'Small'],
    [159.5, 'Small'],
    [160, 'Medium'],
    [200, 'Medium'],
    [240, 'Medium'],
    [241, 'Large'],
    [320, 'Large'],
    [320.5, 'Extra large'],
    [400, 'Extra large'],
  ])('a perimeter of %s in is %s, as published', (p, band) => {
    expect(bandsOf(p)).toEqual([band]);
  });

  it('closes the published gap: 240 1/8 and 240 7/8 go to Large, and no perimeter is in two bands or none', () => {
    expect(bandsOf(240.125)).toEqual(['Large']);
    expect(bandsOf(240.875)).toEqual(['Large']);
    for (let eighths = 8 * 100; eighths <= 8 * 400; eighths++) expect(bandsOf(eighths / 8)).toHaveLength(1);
  });
});

describe('checkSize', () => {
  const medium = bandRule(USUAL_PERIMETER_BANDS[1]);

  it('says which rule failed and by how much', () => {
    // 60 x 66 → 252 in around, 12 in over medium's 240.
    expect(checkSize(medium, mm(60), mm(66))).toEqual({
      field: 'widthIn',
      message: 'This category takes quilts at most 240 in around (perimeter); yours is 252 in around, 12 in over.',
    });
    expect(checkSize(medium, mm(30), mm(40))?.message).toContain('at least 160 in around (perimeter); yours is 140 in around, 20 in short');
  });

  it('takes the limit itself when the rule includes it, and refuses it when it does not', () => {
    expect(checkSize(medium, mm(60), mm(60))).toBeNull(); // 240 exactly
    const small = bandRule(USUAL_PERIMETER_BANDS[0]);
    expect(checkSize(small, mm(40), mm(40))?.message).toContain('less than 160 in around (perimeter); yours is 160 in around, exactly on the limit');
  });

  it('checks width and height separately (a miniature at most 24 x 24)', () => {
    const mini: SizeRule = { kind: 'dimensions', minWidthMm: null, maxWidthMm: mm(24), minHeightMm: null, maxHeightMm: mm(24) };
    expect(checkSize(mini, mm(24), mm(24))).toBeNull();
    expect(checkSize(mini, mm(24.5), mm(20))).toEqual({ field: 'widthIn', message: 'This category takes quilts at most 24 in wide; yours is 24 1/2 in, 1/2 in too wide.' });
    expect(checkSize(mini, mm(20), mm(25 + 3 / 8))?.message).toBe('This category takes quilts at most 24 in high; yours is 25 3/8 in, 1 3/8 in too long.');
    expect(sizeRuleText(mini)).toBe('Quilts at most 24 in wide and at most 24 in high');
  });

  it('reads a typed 60 1/8 as exactly on the eighth, whatever the float noise', () => {
    const rule: SizeRule = { kind: 'dimensions', minWidthMm: null, maxWidthMm: 1526.175, minHeightMm: null, maxHeightMm: null };
    expect(checkSize(rule, mm(60.125), mm(10))).toBeNull();
  });

  it('accepts anything under no rule, and computes a 60 x 72 perimeter of 264 in', () => {
    expect(checkSize({ kind: 'none' }, mm(500), mm(500))).toBeNull();
    expect(perimeterMm(mm(60), mm(72)) / 25.4).toBeCloseTo(264, 9);
    expect(sizeRuleText(USUAL_PERIMETER_BANDS.map(bandRule)[2])).toBe('Perimeter more than 240 in and at most 320 in');
  });
});
