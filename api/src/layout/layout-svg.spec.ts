import { planLayout } from './layout-planner';
import { escapeXml, layoutSummary, layoutSvg } from './layout-svg';

const sampler = planLayout({ rows: 6, columns: 5, blockWidth: 12, blockHeight: 12, sashing: 3, cornerstones: true, borders: [3] });

/** Tags must nest and close; enough to catch broken markup without an XML parser. */
function assertWellFormed(svg: string): void {
  const stack: string[] = [];
  for (const [, closing, name, , selfClosing] of svg.matchAll(/<(\/?)([a-zA-Z]+)((?:\s+[\w:-]+="[^"<]*")*)\s*(\/?)>/g)) {
    if (selfClosing) continue;
    if (closing) expect(stack.pop()).toBe(name);
    else stack.push(name);
  }
  expect(stack).toEqual([]);
  expect(svg.replace(/<[^>]*>/g, '')).not.toMatch(/[<>]/);
}

function count(svg: string, pattern: RegExp): number {
  return (svg.match(pattern) ?? []).length;
}

describe('layoutSvg', () => {
  it('draws every block numbered, to scale in inches', () => {
    const svg = layoutSvg(sampler);
    assertWellFormed(svg);
    expect(svg).toContain('viewBox="0 0 78 93"'); // TRADE.md §3.3, S44
    expect(count(svg, /class="block"/g)).toBe(30);
    expect(svg).toContain('>1</text>');
    expect(svg).toContain('>30</text>');
    expect(count(svg, /class="cornerstone"/g)).toBe(20);
    expect(count(svg, /class="border"/g)).toBe(1);
    expect(svg).toContain('role="img"');
    expect(svg).toContain('fill="#F1EADC"');
    expect(svg).toContain('fill="#C99A2E"');
  });

  it('describes the quilt for people who cannot see it', () => {
    expect(layoutSummary(sampler)).toBe(
      'Quilt top 78 by 93 inches: 5 columns by 6 rows of 12 inch blocks, 3 inch sashing between blocks with cornerstones, 1 border (3 inches)',
    );
    expect(layoutSvg(sampler)).toContain(`<title>${layoutSummary(sampler)}</title>`);
  });

  it('places blocks after sashing that runs round the outside', () => {
    const plan = planLayout({ rows: 4, columns: 5, blockWidth: 12, blockHeight: 12, sashing: 2, sashingAround: true, cornerstones: true });
    const svg = layoutSvg(plan);
    assertWellFormed(svg);
    expect(count(svg, /class="cornerstone"/g)).toBe(30); // TRADE.md §3.4, S46
    expect(svg).toContain('<rect class="block" x="2" y="2"');
    expect(svg).toContain('viewBox="0 0 72 58"');
  });

  it('alternates border colours and fits the longest side to the pixel size', () => {
    const plan = planLayout({ rows: 10, columns: 8, blockWidth: 6, blockHeight: 6, sashing: 2, borders: [2, 3, 5] });
    const svg = layoutSvg(plan, { maxPixels: 196, numberBlocks: false });
    assertWellFormed(svg);
    expect(svg).toContain('viewBox="0 0 82 98"'); // TRADE.md §3.3, S45 (2 + 3 + 5 = 10 inch of borders)
    expect(svg).toContain('width="164" height="196"');
    expect(count(svg, /class="border" [^>]*fill="#A63D2F"/g)).toBe(2);
    expect(count(svg, /class="border" [^>]*fill="#1D5C63"/g)).toBe(1);
    expect(count(svg, /<text/g)).toBe(0);
  });

  it('escapes text it is given', () => {
    const svg = layoutSvg(sampler, { title: 'Jo\'s "Stars" & <Stripes>' });
    assertWellFormed(svg);
    expect(svg).toContain('<title>Jo&apos;s &quot;Stars&quot; &amp; &lt;Stripes&gt;</title>');
    expect(escapeXml('a<b')).toBe('a&lt;b');
  });

  it('handles rectangles and fractions', () => {
    const plan = planLayout({ rows: 3, columns: 2, blockWidth: 12.5, blockHeight: 6.25 });
    const svg = layoutSvg(plan);
    assertWellFormed(svg);
    expect(svg).toContain('viewBox="0 0 25 18.75"');
    expect(layoutSummary(plan)).toBe('Quilt top 25 by 18 3/4 inches: 2 columns by 3 rows of 12 1/2 by 6 1/4 inch blocks');
  });
});
