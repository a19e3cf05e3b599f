import { describe, expect, it } from 'vitest';
import { emptyEntryValues, entrySchema, toEntryInput, toEntryPatch, type EntryValues } from './entry-form';

const categories = [
  { id: 4, name: 'Medium', minMakers: null },
  { id: 7, name: 'Group quilts', minMakers: 3 },
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
    expect(await problems({ ...filled, makers: ['Marigold Fenwick'], widthIn: 'sixty' })).toEqual(['Type the width in inches, like 60, 60 1/2 or 60.5.']);
  });

  it('ask for enough makers for a group quilt and a price for a quilt for sale', async () => {
    expect(await problems({ ...filled, categoryId: '7', makers: ['Marigold Fenwick', 'Tamsin Oakes'] })).toEqual([
      'Group quilts is for quilts made by at least 3 people. Add the other makers.',
    ]);
    expect(await problems({ ...filled, makers: ['Marigold Fenwick'], forSale: true, price: '' })).toEqual(['Enter the price, or untick “For sale”.']);
    expect(await problems({ ...filled, makers: ['Marigold Fenwick'], story: 'x'.repeat(1001) })).toEqual(['Keep the story to 1000 characters.']);
  });
});
