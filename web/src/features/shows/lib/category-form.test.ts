import { describe, expect, it } from 'vitest';
import type { Category } from '../api/types';
import { categorySchema, EMPTY_CATEGORY_VALUES, missingUsualCategories, toCategoryInput, toCategoryValues, type CategoryValues } from './category-form';

const problems = async (values: CategoryValues) => {
  try {
    await categorySchema.validate(values, { abortEarly: false });
    return [];
  } catch (error) {
    return (error as { errors: string[] }).errors;
  }
};

describe('category form', () => {
  it('sends a perimeter band with its inclusive and exclusive ends', () => {
    const values: CategoryValues = { ...EMPTY_CATEGORY_VALUES, name: 'Large', ruleKind: 'perimeter', minIn: '240', minInclusive: 'false', maxIn: '320' };
    expect(toCategoryInput(values, { create: true, sortOrder: 3 })).toEqual({
      name: 'Large',
      judged: true,
      sizeRule: { kind: 'perimeter', minIn: '240', minInclusive: false, maxIn: '320', maxInclusive: true },
      sortOrder: 3,
    });
  });

  it('sends width and height limits, and nulls on a change', () => {
    const values: CategoryValues = { ...EMPTY_CATEGORY_VALUES, name: 'Miniatures', judged: 'exhibit', ruleKind: 'dimensions', maxWidthIn: '24', maxHeightIn: '24 1/2' };
    expect(toCategoryInput(values, { create: false })).toEqual({
      name: 'Miniatures',
      description: '',
      judged: false,
      sizeRule: { kind: 'dimensions', maxWidthIn: '24', maxHeightIn: '24 1/2' },
      minMakers: null,
      maxEntriesPerMember: null,
    });
  });

  it('asks for at least one limit and limits in order', async () => {
    expect(await problems({ ...EMPTY_CATEGORY_VALUES, name: 'X', ruleKind: 'perimeter' })).toEqual([
      'Give a lower or an upper perimeter, or choose “Any size”.',
    ]);
    expect(await problems({ ...EMPTY_CATEGORY_VALUES, name: 'X', ruleKind: 'perimeter', minIn: '200', maxIn: '100' })).toEqual([
      'The lower perimeter must be less than the upper one.',
    ]);
    expect(await problems({ ...EMPTY_CATEGORY_VALUES, name: 'X', ruleKind: 'dimensions' })).toEqual([
      'Give at least one width or height limit, or choose “Any size”.',
    ]);
    expect(await problems({ ...EMPTY_CATEGORY_VALUES, name: 'X', ruleKind: 'dimensions', minWidthIn: '30', maxWidthIn: '24', minHeightIn: '40', maxHeightIn: '36' })).toEqual([
      'The least width is more than the greatest.',
      'The least height is more than the greatest.',
    ]);
  });

  it('refuses a band whose ends meet, as the api does, but allows equal width limits', async () => {
    expect(await problems({ ...EMPTY_CATEGORY_VALUES, name: 'X', ruleKind: 'perimeter', minIn: '200', maxIn: '200' })).toEqual([
      'The lower perimeter must be less than the upper one.',
    ]);
    expect(await problems({ ...EMPTY_CATEGORY_VALUES, name: 'X', ruleKind: 'dimensions', minWidthIn: '24', maxWidthIn: '24' })).toEqual([]);
  });

  it('holds makers, quilts per member, texts and inches to the api’s limits', async () => {
    const makers = 'Enter the least number of makers (2 to 50), or leave it empty.';
    expect(await problems({ ...EMPTY_CATEGORY_VALUES, name: 'X', minMakers: '1' })).toEqual([makers]);
    expect(await problems({ ...EMPTY_CATEGORY_VALUES, name: 'X', minMakers: '51' })).toEqual([makers]);
    expect(await problems({ ...EMPTY_CATEGORY_VALUES, name: 'X', minMakers: '2', maxEntriesPerMember: '50' })).toEqual([]);
    expect(await problems({ ...EMPTY_CATEGORY_VALUES, name: 'X', maxEntriesPerMember: '51' })).toEqual([
      'Enter a whole number of quilts from 1 to 50, or leave it empty for no limit.',
    ]);
    expect(await problems({ ...EMPTY_CATEGORY_VALUES, name: 'x'.repeat(81), description: 'x'.repeat(501) })).toEqual([
      'Use at most 80 characters.',
      'Use at most 500 characters.',
    ]);
    expect(await problems({ ...EMPTY_CATEGORY_VALUES, name: '' })).toEqual(['Name the category.']);
    expect(await problems({ ...EMPTY_CATEGORY_VALUES, name: 'X', ruleKind: 'dimensions', maxWidthIn: '600 1/2' })).toEqual(['Must be at most 600 inches.']);
    expect(await problems({ ...EMPTY_CATEGORY_VALUES, name: 'X', ruleKind: 'perimeter', maxIn: '240,5' })).toEqual([
      'Could not read "240,5" as inches. Write it like 12 1/2, 12.5 or 12½.',
    ]);
    // Limits of a rule she did not choose are not sent, so they do not hold her up.
    expect(await problems({ ...EMPTY_CATEGORY_VALUES, name: 'X', ruleKind: 'none', maxIn: 'big' })).toEqual([]);
  });

  it('fills the form back from millimetres', () => {
    const category = {
      id: 3,
      name: 'Large',
      description: '',
      judged: true,
      sortOrder: 3,
      sizeRule: { kind: 'perimeter', minMm: 6096, minInclusive: false, maxMm: 8128, maxInclusive: true },
      sizeRuleText: '',
      minMakers: null,
      maxEntriesPerMember: 2,
      acceptedCount: 0,
      entryCount: 0,
    } as Category;
    expect(toCategoryValues(category)).toMatchObject({ minIn: '240', minInclusive: 'false', maxIn: '320', maxInclusive: 'true', maxEntriesPerMember: '2' });
  });

  it('adds only the usual bands the show lacks, after the others', () => {
    const missing = missingUsualCategories([
      { name: 'Art quilts', sortOrder: 1 },
      { name: 'medium', sortOrder: 2 },
    ]);
    expect(missing.map((c) => [c.name, c.sortOrder])).toEqual([
      ['Small', 3],
      ['Large', 4],
      ['Extra large', 5],
    ]);
    expect(missingUsualCategories([])[0].sizeRule).toEqual({ kind: 'perimeter', maxIn: '160', maxInclusive: false });
  });
});
