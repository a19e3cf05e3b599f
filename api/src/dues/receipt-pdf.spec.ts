import { execFile } from 'node:child_process';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { MAX_RECEIPT_LINES, Receipt, ReceiptError, renderReceiptPdf, validateReceipt } from './receipt-pdf';

const run = promisify(execFile);

// Invented guild, town and people.
const receipt: Receipt = {
  guildName: "Wrenfield Quilters' Guild",
  guildTown: 'Wrenfield',
  receiptNumber: '2026-0007',
  issuedOn: '2026-03-02',
  memberName: 'Maud Ellery-Pike',
  memberEmail: 'maud.ellery@example.org',
  lines: [
    { label: '2026 dues — Standard', amountCents: 2500 },
    { label: 'Late fee (renewed after 28 February 2026)', amountCents: 500 },
  ],
  totalCents: 3000,
  currency: 'USD',
  paymentMethod: 'Card ending 4242',
  paymentReference: 'PAY-7Q2K-19F',
  coversFrom: '2026-01-01',
  coversThrough: '2026-12-31',
};

let dir: string;
beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), 'selvage-receipt-'));
});
afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

/** The PDF's text as pdftotext lays it out, and its page count. */
async function readBack(pdf: Buffer, name: string): Promise<{ text: string; pages: number }> {
  const file = join(dir, `${name}.pdf`);
  await writeFile(file, pdf);
  const { stdout: text } = await run('pdftotext', ['-layout', '-enc', 'UTF-8', file, '-']);
  const { stdout: info } = await run('pdfinfo', [file]);
  const pages = Number(/^Pages:\s+(\d+)/m.exec(info)?.[1]);
  return { text, pages };
}

/** The text of the line that contains `needle`, with runs of spaces collapsed. */
function lineWith(text: string, needle: string): string {
  const line = text.split('\n').find((l) => l.includes(needle));
  if (line === undefined) throw new Error(`No line contains ${JSON.stringify(needle)} in:\n${text}`);
  return line.replace(/\s+/g, ' ').trim();
}

describe('renderReceiptPdf', () => {
  it('writes a one-page PDF with every part of the receipt', async () => {
    const pdf = await renderReceiptPdf(receipt);
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const { text, pages } = await readBack(pdf, 'standard');
    expect(pages).toBe(1);
    for (const needle of [
      "Wrenfield Quilters' Guild",
      'Receipt',
      'No. 2026-0007',
      '2 March 2026',
      'Maud Ellery-Pike',
      'maud.ellery@example.org',
      '1 January 2026 to 31 December 2026',
      'Card ending 4242',
      'PAY-7Q2K-19F',
      "Thank you for supporting Wrenfield Quilters' Guild.",
    ])
      expect(text).toContain(needle);
    // Each amount on the same line as its label.
    expect(lineWith(text, '2026 dues')).toBe('2026 dues — Standard $25.00');
    expect(lineWith(text, 'Late fee')).toBe('Late fee (renewed after 28 February 2026) $5.00');
    expect(lineWith(text, 'Total paid')).toBe('Total paid $30.00');
  });

  it('renders the same bytes for the same receipt', async () => {
    const [a, b] = await Promise.all([renderReceiptPdf(receipt), renderReceiptPdf(receipt)]);
    expect(a.equals(b)).toBe(true);
  });

  it('shows yen without decimals and euros with them', async () => {
    const yen = await readBack(
      await renderReceiptPdf({
        ...receipt,
        currency: 'JPY',
        lines: [{ label: '2026 dues — Standard', amountCents: 3000 }],
        totalCents: 3000,
      }),
      'yen',
    );
    expect(lineWith(yen.text, '2026 dues')).toBe('2026 dues — Standard ¥3,000');
    expect(lineWith(yen.text, 'Total paid')).toBe('Total paid ¥3,000');

    const euro = await readBack(
      await renderReceiptPdf({
        ...receipt,
        currency: 'EUR',
        lines: [
          { label: 'Half of 2026 dues — Standard (joined in July)', amountCents: 1251 },
          { label: 'Workshop: scrappy stars', amountCents: 123456 },
        ],
        totalCents: 124707,
      }),
      'euro',
    );
    // A long label wraps inside its column; the amount stays on its first line.
    expect(lineWith(euro.text, 'Half of 2026')).toBe('Half of 2026 dues — Standard (joined in €12.51');
    expect(lineWith(euro.text, 'July)')).toBe('July)');
    expect(lineWith(euro.text, 'Workshop')).toBe('Workshop: scrappy stars €1,234.56');
    expect(lineWith(euro.text, 'Total paid')).toBe('Total paid €1,247.07');
  });

  it('shows amounts in the given locale', async () => {
    const { text } = await readBack(await renderReceiptPdf({ ...receipt, currency: 'EUR', locale: 'de-DE' }), 'de');
    expect(lineWith(text, 'Total paid')).toBe('Total paid 30,00 €');
  });

  it('falls back to the currency code when the fonts lack the symbol', async () => {
    const { text } = await readBack(
      await renderReceiptPdf({ ...receipt, currency: 'INR', lines: [{ label: 'Dues', amountCents: 150000 }], totalCents: 150000 }),
      'inr',
    );
    expect(lineWith(text, 'Total paid')).toBe('Total paid INR 1,500.00');
  });

  it('prints Latin-1 names exactly', async () => {
    const { text } = await readBack(await renderReceiptPdf({ ...receipt, memberName: 'Zoë Ångström-Núñez' }), 'latin1');
    expect(text).toContain('Zoë Ångström-Núñez');
  });

  it('drops the accents of letters the embedded fonts lack, rather than printing empty boxes', async () => {
    const { text } = await readBack(await renderReceiptPdf({ ...receipt, memberName: 'Łucja Őrsi-Ștefan 王' }), 'ext');
    expect(text).toContain('Lucja Orsi-Stefan ?');
  });

  it('leaves out the optional parts when they are not given', async () => {
    const { guildTown, memberEmail, coversFrom, coversThrough, ...rest } = receipt;
    void [guildTown, memberEmail, coversFrom, coversThrough];
    const { text, pages } = await readBack(await renderReceiptPdf(rest), 'minimal');
    expect(pages).toBe(1);
    expect(text).not.toContain('Membership');
    expect(text).not.toContain('@');
    expect(text).toContain('2026-0007');
  });

  it(`fits ${MAX_RECEIPT_LINES} lines on one page`, async () => {
    const lines = Array.from({ length: MAX_RECEIPT_LINES }, (_, i) => ({ label: `Raffle ticket ${i + 1}`, amountCents: 100 }));
    const { text, pages } = await readBack(await renderReceiptPdf({ ...receipt, lines, totalCents: 100 * MAX_RECEIPT_LINES }), 'many');
    expect(pages).toBe(1);
    expect(lineWith(text, `Raffle ticket ${MAX_RECEIPT_LINES}`)).toBe(`Raffle ticket ${MAX_RECEIPT_LINES} $1.00`);
    expect(lineWith(text, 'Total paid')).toBe('Total paid $10.00');
  });

  it('refuses a receipt that would need a second page', async () => {
    const label = 'A very long description of a quilt show entry fee that goes on and on. '.repeat(4);
    const lines = Array.from({ length: MAX_RECEIPT_LINES }, () => ({ label, amountCents: 100 }));
    await expect(renderReceiptPdf({ ...receipt, lines, totalCents: 100 * MAX_RECEIPT_LINES })).rejects.toThrow(/does not fit on one page/);
  });

  it('refuses a total that does not match the lines', async () => {
    await expect(renderReceiptPdf({ ...receipt, totalCents: 2999 })).rejects.toThrow(ReceiptError);
    await expect(renderReceiptPdf({ ...receipt, totalCents: 2999 })).rejects.toThrow(
      'The receipt cannot be printed: The total does not match the sum of the lines.',
    );
  });
});

describe('validateReceipt', () => {
  it('accepts a complete receipt', () => {
    expect(validateReceipt(receipt)).toEqual([]);
  });

  it('lists every problem', () => {
    expect(
      validateReceipt({
        ...receipt,
        guildName: '',
        receiptNumber: ' ',
        issuedOn: '2026-02-30',
        memberName: '',
        paymentMethod: '',
        paymentReference: '',
        currency: 'Dollars',
        coversFrom: '2026-12-31',
        coversThrough: '2026-01-01',
        lines: [
          { label: '', amountCents: 2500 },
          { label: 'Late fee', amountCents: 5.5 },
        ],
        totalCents: 3000,
      }),
    ).toEqual([
      'The guild name is missing.',
      'The receipt number is missing.',
      'The issue date must be written yyyy-mm-dd, got "2026-02-30".',
      "The member's name is missing.",
      'The payment method is missing.',
      'The payment reference is missing.',
      '"Dollars" is not a currency code; use three letters like USD.',
      'The period paid for ends before it starts.',
      'Line 1 has no label.',
      'The amount on line 2 must be a whole number of minor units (cents), got 5.5.',
    ]);
  });

  it('needs lines, and a total that is a whole, non-negative number', () => {
    expect(validateReceipt({ ...receipt, lines: [], totalCents: 0 })).toEqual(['The receipt has no lines.']);
    expect(validateReceipt({ ...receipt, totalCents: 30.0001 })).toEqual([
      'The total must be a whole number of minor units (cents), got 30.0001.',
    ]);
    expect(validateReceipt({ ...receipt, lines: [{ label: 'Refund', amountCents: -500 }], totalCents: -500 })).toEqual([
      'The total cannot be negative.',
    ]);
    expect(validateReceipt({ ...receipt, coversFrom: '1 Jan 2026' })).toEqual([
      'The start of the period paid for must be written yyyy-mm-dd, got "1 Jan 2026".',
    ]);
    const tooMany = Array.from({ length: MAX_RECEIPT_LINES + 1 }, () => ({ label: 'Pin', amountCents: 100 }));
    expect(validateReceipt({ ...receipt, lines: tooMany, totalCents: 100 * (MAX_RECEIPT_LINES + 1) })).toEqual([
      `A receipt holds at most ${MAX_RECEIPT_LINES} lines, got ${MAX_RECEIPT_LINES + 1}.`,
    ]);
  });
});
