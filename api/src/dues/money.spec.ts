import seedrandom from 'seedrandom';
import {
  MoneyError,
  assertCents,
  centsToDecimalString,
  formatMoney,
  halfOfCents,
  minorUnitDigits,
  parseMoney,
  percentOfCents,
  sumCents,
} from './money';

describe('minorUnitDigits', () => {
  it('knows the decimal places of common currencies', () => {
    expect(minorUnitDigits('USD')).toBe(2);
    expect(minorUnitDigits('EUR')).toBe(2);
    expect(minorUnitDigits('JPY')).toBe(0);
    expect(minorUnitDigits('KWD')).toBe(3);
    expect(minorUnitDigits('usd')).toBe(2);
  });

  it('rejects codes that are not three letters', () => {
    expect(() => minorUnitDigits('US')).toThrow(MoneyError);
    expect(() => minorUnitDigits('$')).toThrow(/three letters/);
  });

  it('rejects three letters that are not an ISO 4217 currency (Intl alone would format them)', () => {
    expect(() => minorUnitDigits('XYZ')).toThrow('"XYZ" is not a currency this system knows.');
    expect(() => parseMoney('25', 'ABC')).toThrow(MoneyError);
  });
});

describe('parseMoney', () => {
  it.each([
    ['25', 2500],
    ['25.00', 2500],
    ['$25', 2500],
    ['$ 25', 2500],
    ['25 USD', 2500],
    ['usd 25', 2500],
    ['1,234.50', 123450],
    ['$1,234.50', 123450],
    ['  30.5 ', 3050],
    ['0.05', 5],
    ['.5', 50],
    ['25.', 2500],
    ['0', 0],
    ['007', 700],
    ['1,000,000', 100000000],
  ])('reads %p as %p cents (USD)', (input, cents) => {
    expect(parseMoney(input, 'USD')).toBe(cents);
  });

  it('does not go through floating point', () => {
    // 0.1 + 0.2 style trouble: 1.15 * 100 is 114.99999999999999 as a float.
    expect(parseMoney('1.15', 'USD')).toBe(115);
    expect(parseMoney('4.35', 'USD')).toBe(435);
    expect(parseMoney('90,071,992,547,409.91', 'USD')).toBe(Number.MAX_SAFE_INTEGER);
  });

  it('reads euros and yen', () => {
    expect(parseMoney('€25.00', 'EUR')).toBe(2500);
    expect(parseMoney('25 EUR', 'EUR')).toBe(2500);
    expect(parseMoney('¥3,000', 'JPY')).toBe(3000);
    expect(parseMoney('3000', 'JPY')).toBe(3000);
    expect(parseMoney('1.250', 'KWD')).toBe(1250);
  });

  it.each(['', '   ', 'abc', '25,00', '1,23', '12,3456', '2 5', '25.0.0', '$', '1e3', '0x10', '25%', '(25)', '+25'])(
    'rejects %p with the plain-language hint',
    (input) => {
      expect(() => parseMoney(input, 'USD')).toThrow('Type an amount like 25 or 25.00.');
    },
  );

  it('rejects negative amounts', () => {
    expect(() => parseMoney('-5', 'USD')).toThrow('Amounts cannot be negative.');
    expect(() => parseMoney('$-5', 'USD')).toThrow('Amounts cannot be negative.');
    expect(() => parseMoney(' -$5.00', 'USD')).toThrow('Amounts cannot be negative.');
  });

  it('rejects more decimals than the currency has', () => {
    expect(() => parseMoney('25.001', 'USD')).toThrow('USD amounts have at most 2 decimal places.');
    expect(() => parseMoney('25.000', 'EUR')).toThrow('EUR amounts have at most 2 decimal places.');
    expect(() => parseMoney('3000.5', 'JPY')).toThrow('JPY amounts are whole numbers, with no decimal point.');
    expect(() => parseMoney('3000.', 'JPY')).toThrow(/whole numbers/);
  });

  it("rejects another currency's symbol", () => {
    expect(() => parseMoney('€25', 'USD')).toThrow(MoneyError);
    expect(() => parseMoney('$25', 'EUR')).toThrow(MoneyError);
  });

  it('rejects amounts beyond safe integers', () => {
    expect(() => parseMoney('90,071,992,547,409.92', 'USD')).toThrow('That amount is too large.');
    expect(() => parseMoney('99999999999999999999', 'JPY')).toThrow('That amount is too large.');
  });
});

describe('formatMoney', () => {
  it('formats dollars, euros and yen', () => {
    expect(formatMoney(2500, 'USD')).toBe('$25.00');
    expect(formatMoney(5, 'USD')).toBe('$0.05');
    expect(formatMoney(0, 'USD')).toBe('$0.00');
    expect(formatMoney(123450, 'USD')).toBe('$1,234.50');
    expect(formatMoney(2500, 'EUR')).toBe('€25.00');
    expect(formatMoney(3000, 'JPY')).toBe('¥3,000');
    expect(formatMoney(1250, 'KWD').replace(/\s/g, ' ')).toBe('KWD 1.250');
  });

  it('formats in other locales', () => {
    // Intl's German output puts a no-break space before the symbol.
    expect(formatMoney(123450, 'EUR', 'de-DE').replace(/\s/g, ' ')).toBe('1.234,50 €');
    expect(formatMoney(3000, 'JPY', 'ja-JP')).toBe('￥3,000'); // full-width yen sign in Japanese
  });

  it('can show the currency code instead of the symbol', () => {
    expect(formatMoney(2500, 'USD', 'en-US', 'code').replace(/\s/g, ' ')).toBe('USD 25.00');
  });

  it('formats negative amounts (refunds)', () => {
    expect(formatMoney(-5, 'USD')).toBe('-$0.05');
    expect(formatMoney(-123450, 'USD')).toBe('-$1,234.50');
  });

  it('is exact for the largest safe amounts', () => {
    expect(formatMoney(Number.MAX_SAFE_INTEGER, 'USD')).toBe('$90,071,992,547,409.91');
    expect(formatMoney(Number.MAX_SAFE_INTEGER, 'JPY')).toBe('¥9,007,199,254,740,991');
    expect(formatMoney(Number.MAX_SAFE_INTEGER - 1, 'EUR')).toBe('€90,071,992,547,409.90');
  });

  it('rejects non-integers and unsafe integers', () => {
    expect(() => formatMoney(25.5, 'USD')).toThrow(/whole number of minor units/);
    expect(() => formatMoney(NaN, 'USD')).toThrow(MoneyError);
    expect(() => formatMoney(Number.MAX_SAFE_INTEGER + 1, 'USD')).toThrow(MoneyError);
    expect(() => formatMoney('25' as unknown as number, 'USD')).toThrow(MoneyError);
  });
});

describe('centsToDecimalString', () => {
  it('writes exact decimals', () => {
    expect(centsToDecimalString(5, 2)).toBe('0.05');
    expect(centsToDecimalString(-5, 2)).toBe('-0.05');
    expect(centsToDecimalString(123450, 2)).toBe('1234.50');
    expect(centsToDecimalString(1250, 3)).toBe('1.250');
    expect(centsToDecimalString(3000, 0)).toBe('3000');
  });
});

describe('parseMoney(formatMoney(x)) round trip', () => {
  const rng = seedrandom('wrenfield-dues');
  const samples: number[] = [0, 1, 9, 10, 99, 100, 101, 999, 1000, 2500, 100000, Number.MAX_SAFE_INTEGER];
  // Amounts of every magnitude from 1 to 16 digits.
  for (let i = 0; i < 2000; i++) {
    const magnitude = 1 + (i % 16);
    samples.push(Math.min(Number.MAX_SAFE_INTEGER, Math.floor(rng() * 10 ** magnitude)));
  }

  it.each(['USD', 'EUR', 'JPY', 'KWD', 'GBP', 'CAD'])('holds for %s', (currency) => {
    for (const x of samples) {
      const text = formatMoney(x, currency);
      expect(parseMoney(text, currency)).toBe(x);
    }
  });
});

describe('percentOfCents and halfOfCents (half-up, integer arithmetic)', () => {
  it('rounds exact halves up', () => {
    expect(halfOfCents(2500)).toBe(1250);
    expect(halfOfCents(2501)).toBe(1251);
    expect(halfOfCents(1)).toBe(1);
    expect(halfOfCents(0)).toBe(0);
    expect(halfOfCents(3001)).toBe(1501);
  });

  it('mirrors for negative amounts (away from zero)', () => {
    expect(halfOfCents(-2501)).toBe(-1251);
    expect(percentOfCents(-999, 250)).toBe(-25);
  });

  it('computes basis points', () => {
    expect(percentOfCents(2500, 10000)).toBe(2500);
    expect(percentOfCents(2500, 2000)).toBe(500);
    expect(percentOfCents(999, 250)).toBe(25); // 24.975
    expect(percentOfCents(1000, 333)).toBe(33); // 33.3
    expect(percentOfCents(1000, 335)).toBe(34); // 33.5
    expect(percentOfCents(1000, 0)).toBe(0);
  });

  it('stays exact where a float product would not', () => {
    // 9007199254740991 * 5000 is far beyond 2^53; BigInt keeps it exact.
    expect(halfOfCents(Number.MAX_SAFE_INTEGER)).toBe(4503599627370496);
    expect(percentOfCents(Number.MAX_SAFE_INTEGER, 1)).toBe(900719925474) // 900719925474.0991;
    expect(() => percentOfCents(Number.MAX_SAFE_INTEGER, 20000)).toThrow('That amount is too large.');
  });

  it('rejects fractional inputs', () => {
    expect(() => percentOfCents(10.5, 100)).toThrow(MoneyError);
    expect(() => percentOfCents(1000, 12.5)).toThrow(/basis points/);
  });
});

describe('sumCents and assertCents', () => {
  it('adds safely', () => {
    expect(sumCents([2500, 500, -100])).toBe(2900);
    expect(sumCents([])).toBe(0);
    expect(() => sumCents([Number.MAX_SAFE_INTEGER, 1])).toThrow('That amount is too large.');
  });

  it('names the value in the message', () => {
    expect(() => assertCents(1.5, 'Late fee')).toThrow('Late fee must be a whole number of minor units (cents), got 1.5.');
  });
});
