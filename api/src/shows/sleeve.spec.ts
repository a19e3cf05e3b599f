import { DEFAULT_SLEEVE, sleeveFor, sleeveRuleText } from './sleeve';

describe('sleeveFor', () => {
  it('cuts a 4 in sleeve for a 60 in quilt from an 8 1/2 x 59 strip (TRADE.md check values, S54)', () => {
    const cut = sleeveFor(60);
    expect(cut).toMatchObject({ depthIn: 4, stripWidthIn: 8.5, stripLengthIn: 59, pieces: 1 });
    expect(cut.text).toBe('A 4 in sleeve: cut a strip 8 1/2 in x 59 in.');
  });

  it('uses a 3 in sleeve under 30 in wide (S54): a 24 1/2 in quilt cuts 6 1/2 x 23 1/2', () => {
    expect(sleeveFor(24.5)).toMatchObject({ depthIn: 3, stripWidthIn: 6.5, stripLengthIn: 23.5 });
    expect(sleeveFor(30).depthIn).toBe(4);
  });

  it('splits the sleeve over 90 in wide (S54): a 100 in quilt cuts two strips of 49 in', () => {
    expect(sleeveFor(100)).toMatchObject({ depthIn: 4, stripLengthIn: 49, pieces: 2 });
    expect(sleeveFor(90).pieces).toBe(1);
    expect(sleeveFor(100).text).toBe('A 4 in split sleeve: cut two strips 8 1/2 in x 49 in and leave a gap in the middle.');
  });

  it('follows a show that asks for 6 in sleeves with no narrow or split rule', () => {
    const rule = { depthIn: 6, narrowUnderIn: null, narrowDepthIn: null, splitOverIn: null };
    expect(sleeveFor(20, rule)).toMatchObject({ depthIn: 6, stripWidthIn: 12.5, stripLengthIn: 19, pieces: 1 });
    expect(sleeveRuleText(rule)).toBe(
      "Every quilt needs a 6 in hanging sleeve sewn to the top of the back. Cut the strip twice the sleeve's depth plus 1/2 in wide and the quilt's width less 1 in long.",
    );
    expect(sleeveRuleText(DEFAULT_SLEEVE)).toContain('quilts under 30 in wide may use a 3 in sleeve; quilts over 90 in wide need a split sleeve');
  });
});
