import { renderInstructions } from './markdown';

describe('renderInstructions', () => {
  it('formats bold, italic, lists and links', () => {
    const html = renderInstructions('**Low volume** prints, *please*.\n\n- one\n- two\n\n[guide](https://example.org/guide)');
    expect(html).toContain('<strong>Low volume</strong>');
    expect(html).toContain('<em>please</em>');
    expect(html).toContain('<li>one</li>');
    expect(html).toContain('href="https://example.org/guide"');
    expect(html).toContain('rel="noopener noreferrer nofollow"');
  });
  it('shows raw HTML as text and drops dangerous links', () => {
    const html = renderInstructions('<script>alert(1)</script> <img src=x onerror=alert(1)> [x](javascript:alert(1))');
    expect(html).not.toMatch(/<script|<img|href="javascript/);
    expect(html).toContain('&lt;script&gt;');
  });
});
