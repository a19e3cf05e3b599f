import { describe, expect, it } from 'vitest';
import { emptyEntryValues, entrySchema, toEntryInput, toEntryPatch, type EntryValues } from './entry-form';

const mm = (inches: number) => inches * 25.4;
const categories = [
  { id: 4, name: 'Medium', minMakers: null },
  { id: 7, name: 'Group quilts', minMakers: 3 },
  { id: 9, name: 'Small', minMakers: null, sizeRule: { kind: 'perimeter' as const, minMm: null, minInclusive: true, maxMm: mm(160), maxInclusive: false } },
];

const filled: EntryValues = {
  ...emptyEntryValues('Marigold Fenwick', categories),
  categoryId: '4',
  title: '  Mill Pond at Dusk ',
  widthIn: '60 1/2',
  heightIn: '60½',
  makers: ['Marigold Fenwick', ' ', 'Tamsin Oakes '],
  quilter: 'Tamsin Oakes',
};

const problems = async (values: EntryValues) => {
  try {
    await entrySchema('USD', categories).validate(values, { abortEarly: false });
    return [];
  } catch (error) {
    return (error as { errors: string[] }).errors;
  }
};

describe('entry form values', () => {
  it('start with her own name as the maker', () => {
    expect(emptyEntryValues('Marigold Fenwick', categories).makers).toEqual(['Marigold Fenwick']);
    expect(emptyEntryValues('Marigold Fenwick', [categories[0]]).categoryId).toBe('4');
  });

  it('become the api body with inch text as typed, trimmed makers and whole cents', () => {
    expect(toEntryInput({ ...filled, forSale: true, price: '$1,250.50', onBehalfOf: '31' }, 'USD')).toEqual({
      categoryId: 4,
      title: 'Mill Pond at Dusk',
      widthIn: '60 1/2',
      heightIn: '60½',
      makers: ['Marigold Fenwick', 'Tamsin Oakes'],
      quilter: 'Tamsin Oakes',
      forSale: true,
      priceCents: 125050,
      onBehalfOf: 31,
    });
    expect(toEntryInput({ ...filled, price: '99' }, 'USD')).not.toHaveProperty('priceCents');
  });

  it('send a change with the price cleared and the category only when it moved', () => {
    const patch = toEntryPatch({ ...filled, story: ' ' }, 'USD', { categoryId: 4 });
    expect(patch).not.toHaveProperty('categoryId');
    expect(patch).toMatchObject({ story: '', priceCents: null, forSale: false });
    expect(toEntryPatch({ ...filled, categoryId: '7' }, 'USD', { categoryId: 4 }).categoryId).toBe(7);
  });
});

describe('entry form checks', () => {
  it('read sizes the way quilters write them', async () => {
    expect(await problems({ ...filled, makers: ['Marigold Fenwick'] })).toEqual([]);
    expect(await problems({ ...filled, makers: ['Marigold Fenwick'], widthIn: 'sixty' })).toEqual([
      'Could not read "sixty" as inches. Write it like 12 1/2, 12.5 or 12½.',
    ]);
  });

  it('refuse what the api refuses, in its words: a decimal comma, a fraction of 1 or more, a size out of range', async () => {
    const one = { ...filled, makers: ['Marigold Fenwick'] };
    expect(await problems({ ...one, widthIn: '60,5' })).toEqual(['Could not read "60,5" as inches. Write it like 12 1/2, 12.5 or 12½.']);
    expect(await problems({ ...one, heightIn: '60 3/2' })).toEqual([
      'Could not read "60 3/2" as inches. The fraction after the whole number must be less than 1. Write it like 12 1/2, 12.5 or 12½.',
    ]);
    expect(await problems({ ...one, widthIn: '3 1/2', heightIn: '200 1/2' })).toEqual(['Must be at least 4 inches.', 'Must be at most 200 inches.']);
  });

  it('refuse a quilt its category does not take, under the field the api names', async () => {
    expect(await problems({ ...filled, categoryId: '9', makers: ['Marigold Fenwick'], widthIn: '61', heightIn: '60' })).toEqual([
      'This category takes quilts less than 160 in around (perimeter); yours is 242 in around, 82 in over.',
    ]);
  });

  it('hold texts and makers to the api’s limits, and let the quilter be left empty', async () => {
    const one = { ...filled, makers: ['Marigold Fenwick'] };
    expect(await problems({ ...one, quilter: '' })).toEqual([]);
    expect(await problems({ ...one, title: 'x'.repeat(161) })).toEqual(['Use at most 160 characters.']);
    expect(await problems({ ...one, quilter: 'x'.repeat(121), techniques: 'x'.repeat(301) })).toEqual([
      'Use at most 120 characters.',
      'Use at most 300 characters.',
    ]);
    expect(await problems({ ...one, makers: ['x'.repeat(121)] })).toEqual(["Use at most 120 characters for each maker's name."]);
    expect(await problems({ ...one, makers: Array.from({ length: 31 }, (_, i) => `Maker ${i}`) })).toEqual(['List at most 30 makers.']);
    expect(await problems({ ...one, forSale: true, price: '100000.01' })).toEqual(['The price can be at most 100000.00.']);
    expect(toEntryInput({ ...one, quilter: ' ' }, 'USD')).not.toHaveProperty('quilter');
  });

  it('ask for enough makers for a group quilt and a price for a quilt for sale', async () => {
    expect(await problems({ ...filled, categoryId: '7', makers: ['Marigold Fenwick', 'Tamsin Oakes', 'tamsin oakes'] })).toEqual([
      'Group quilts is for quilts made by 3 or more people; this one names 2. Add the other makers.',
    ]);
    expect(await problems({ ...filled, makers: ['Marigold Fenwick'], forSale: true, price: '' })).toEqual(['Enter the price, or untick “For sale”.']);
    expect(await problems({ ...filled, makers: ['Marigold Fenwick'], story: 'x'.repeat(1001) })).toEqual(['Keep the story to 1,000 characters.']);
  });
});
