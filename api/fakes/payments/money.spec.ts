import { currencyDigits, decimalString, formatAmount, processingFee } from './money';

describe('processingFee (2.9 % rounded half-up to the cent, plus 30 cents)', () => {
  it.each([
    [2500, 103], // 72.5 → 73, + 30
    [1000, 59], // 29 exactly
    [50, 31], // 1.45 → 1
    [500, 45], // 14.5 → 15
    [1, 30], // 0.029 → 0
    [0, 30],
    [99_999_999, 2_900_030], // 2 899 999.971 → 2 900 000
  ])('fee on %i is %i', (amount, fee) => {
    expect(processingFee(amount)).toBe(fee);
  });

  it('refuses fractional or negative amounts', () => {
    expect(() => processingFee(10.5)).toThrow(RangeError);
    expect(() => processingFee(-1)).toThrow(RangeError);
  });
});

describe('amount formatting', () => {
  it('writes exact decimals from minor units', () => {
    expect(decimalString(2500, 'usd')).toBe('25.00');
    expect(decimalString(5, 'usd')).toBe('0.05');
    expect(decimalString(-1050, 'usd')).toBe('-10.50');
    expect(decimalString(500, 'jpy')).toBe('500');
    expect(currencyDigits('jpy')).toBe(0);
    expect(currencyDigits('not-a-currency')).toBe(2);
  });

  it('formats with the currency symbol', () => {
    expect(formatAmount(4500, 'usd')).toBe('$45.00');
    expect(formatAmount(123456, 'cad')).toBe('CA$1,234.56');
    expect(formatAmount(500, 'jpy')).toBe('¥500');
  });
});
