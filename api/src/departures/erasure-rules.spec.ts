import { erasureRefusals, formerMemberName, replaceName, type ErasureFacts } from './erasure-rules';

const usd = (cents: number, currency: string) => `${currency === 'USD' ? '$' : currency + ' '}${(cents / 100).toFixed(2)}`;
const gone: ErasureFacts = { status: 'left', erasedAt: null, activeElsewhere: [], unpaid: [] };

describe('erasureRefusals', () => {
  it('lets a departed member with nothing owing be erased', () => {
    expect(erasureRefusals(gone, usd)).toEqual([]);
  });

  it('refuses a member who has not left, one still in another guild, and one with unpaid invoices, saying each', () => {
    const refusals = erasureRefusals(
      {
        status: 'active',
        erasedAt: null,
        activeElsewhere: ['Millbrook Modern Quilters'],
        unpaid: [
          { id: 7, purpose: 'dues', yearLabel: '2026', totalCents: 3000, currency: 'USD' },
          { id: 9, purpose: 'show_entry', yearLabel: 'Spring show', totalCents: 500, currency: 'USD' },
        ],
      },
      usd,
    );
    expect(refusals.map((r) => r.code)).toEqual(['still_member', 'member_elsewhere', 'unpaid_invoices']);
    expect(refusals[1].message).toContain('Millbrook Modern Quilters');
    expect(refusals[2].message).toBe(
      'She has 2 unpaid invoices (2026 dues $30.00; Spring show entry fees $5.00). The treasurer must record the payment or void them first, so the books stay whole.',
    );
  });

  it('says one unpaid invoice in the singular', () => {
    const [r] = erasureRefusals({ ...gone, unpaid: [{ id: 1, purpose: 'dues', yearLabel: '2027', totalCents: 2500, currency: 'USD' }] }, usd);
    expect(r.message).toMatch(/^She has an unpaid invoice \(2027 dues \$25\.00\)\. .* void it first/);
  });

  it('does nothing twice', () => {
    expect(erasureRefusals({ ...gone, erasedAt: new Date() }, usd).map((r) => r.code)).toEqual(['already_erased']);
  });
});

describe('formerMemberName and replaceName', () => {
  it('names the record by its membership number only', () => {
    expect(formerMemberName(42)).toBe('Former member 42');
  });

  it('replaces her name however it was typed, and leaves co-makers alone', () => {
    expect(replaceName(['  june  pettigrew', 'Rosa Lind', 'JUNE PETTIGREW'], 'June Pettigrew', 'Former member 3')).toEqual([
      'Former member 3',
      'Rosa Lind',
      'Former member 3',
    ]);
    expect(replaceName([], 'June', 'X')).toEqual([]);
  });
});
