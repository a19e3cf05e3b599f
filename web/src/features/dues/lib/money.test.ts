import { describe, expect, it } from 'vitest';
import { centsToDecimalString, centsToInput, formatMoney, minorDigits, moneyToCents, parseMoney } from './money';

describe('centsToDecimalString', () => {
  it('moves the point in the text, never through a float', () => {
    expect(centsToDecimalString(2550, 2)).toBe('25.50');
    expect(centsToDecimalString(5, 2)).toBe('0.05');
    expect(centsToDecimalString(0, 2)).toBe('0.00');
    expect(centsToDecimalString(-1999, 2)).toBe('-19.99');
    expect(centsToDecimalString(3000, 0)).toBe('3000');
    expect(centsToDecimalString(1234, 3)).toBe('1.234');
    // 0.1 + 0.2 style errors cannot happen: every digit survives.
    expect(centsToDecimalString(Number.MAX_SAFE_INTEGER, 2)).toBe('90071992547409.91');
  });

  it('refuses fractions of a cent', () => {
    expect(() => centsToDecimalString(25.5, 2)).toThrow(RangeError);
  });
});

describe('formatMoney', () => {
  it('formats by the currency’s own number of digits', () => {
    expect(minorDigits('USD')).toBe(2);
    expect(minorDigits('JPY')).toBe(0);
    expect(minorDigits('KWD')).toBe(3);
    expect(formatMoney(2550, 'USD')).toBe('$25.50');
    expect(formatMoney(123450, 'USD')).toBe('$1,234.50');
    expect(formatMoney(0, 'USD')).toBe('$0.00');
    expect(formatMoney(-500, 'USD')).toBe('-$5.00');
    expect(formatMoney(3000, 'JPY')).toBe('¥3,000');
    expect(formatMoney(2550, 'EUR')).toBe('€25.50');
    expect(formatMoney(1234, 'KWD')).toMatch(/1\.234/);
  });

  it('keeps amounts beyond what a float divided by 100 would hold exactly', () => {
    expect(formatMoney(Number.MAX_SAFE_INTEGER, 'USD')).toBe('$90,071,992,547,409.91');
  });

  it('gives a plain amount for a text box', () => {
    expect(centsToInput(4000, 'USD')).toBe('40.00');
    expect(centsToInput(4000, 'JPY')).toBe('4000');
    expect(centsToInput(null, 'USD')).toBe('');
  });
});

describe('parseMoney', () => {
  const cents = (text: string, currency = 'USD') => {
    const parsed = parseMoney(text, currency);
    return parsed.ok ? parsed.cents : parsed.message;
  };

  it('reads what people type', () => {
    expect(cents('25')).toBe(2500);
    expect(cents('25.5')).toBe(2550);
    expect(cents('25.50')).toBe(2550);
    expect(cents(' $25.50 ')).toBe(2550);
    expect(cents('USD 40')).toBe(4000);
    expect(cents('40 USD')).toBe(4000);
    expect(cents('1,234.50')).toBe(123450);
    expect(cents('.75')).toBe(75);
    expect(cents('0')).toBe(0);
    expect(cents('19.99')).toBe(1999);
    // The classic float trap: 0.29 * 100 is 28.999999999999996.
    expect(cents('0.29')).toBe(29);
    expect(cents('1.15')).toBe(115);
  });

  it('knows currencies without cents', () => {
    expect(cents('3000', 'JPY')).toBe(3000);
    expect(cents('¥3,000', 'JPY')).toBe(3000);
    expect(cents('3000.5', 'JPY')).toBe('JPY amounts are whole numbers, with no decimal point.');
  });

  it('explains what is wrong', () => {
    expect(cents('')).toBe('Enter an amount.');
    expect(cents('   ')).toBe('Enter an amount.');
    expect(cents('-5')).toBe('The amount cannot be negative.');
    expect(cents('$-5')).toBe('The amount cannot be negative.');
    expect(cents('25.505')).toBe('Use at most 2 digits after the point, like 25 or 25.00.');
    expect(cents('twenty')).toBe('Type an amount like 25 or 25.00.');
    expect(cents('25,50')).toBe('Type an amount like 25 or 25.00.');
    expect(cents('1,23')).toBe('Type an amount like 25 or 25.00.');
    expect(cents('€25')).toBe('Type an amount like 25 or 25.00.');
    expect(cents('99999999999999999')).toBe('That amount is too large.');
  });

  it('throws from moneyToCents on text that was not checked', () => {
    expect(moneyToCents('12.30', 'USD')).toBe(1230);
    expect(() => moneyToCents('abc', 'USD')).toThrow('Type an amount like 25 or 25.00.');
  });
});
