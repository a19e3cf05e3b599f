import { centsColumn, csvCell, toCsv } from './csv';

describe('csv', () => {
  it('quotes commas, quotes and line breaks, and leaves plain text alone', () => {
    expect(csvCell('June Pettigrew')).toBe('June Pettigrew');
    expect(csvCell('Pettigrew, June')).toBe('"Pettigrew, June"');
    expect(csvCell('The "Wonky" Star')).toBe('"The ""Wonky"" Star"');
    expect(csvCell('Line one\nline two')).toBe('"Line one\nline two"');
    expect(csvCell(null)).toBe('');
    expect(csvCell(3000)).toBe('3000');
  });

  it('keeps spreadsheet formulas from running', () => {
    expect(csvCell('=HYPERLINK("http://x")')).toBe('"\'=HYPERLINK(""http://x"")"');
    expect(csvCell('+1')).toBe("'+1");
    expect(csvCell('@SUM(A1)')).toBe("'@SUM(A1)");
    expect(csvCell(-5)).toBe('-5');
    expect(csvCell('-5.00')).toBe('-5.00');
    expect(csvCell('-5.00 refund')).toBe("'-5.00 refund");
  });

  it('writes a header and rows with CRLF line ends after a byte-order mark', () => {
    expect(toCsv(['a', 'b'], [['1', 2], [null, 'x,y']])).toBe('\uFEFFa,b\r\n1,2\r\n,"x,y"\r\n');
  });

  it('writes minor units as plain decimals', () => {
    expect(centsColumn(3050, 2)).toBe('30.50');
    expect(centsColumn(5, 2)).toBe('0.05');
    expect(centsColumn(-500, 2)).toBe('-5.00');
    expect(centsColumn(3000, 0)).toBe('3000');
    expect(centsColumn(1234, 3)).toBe('1.234');
  });
});
