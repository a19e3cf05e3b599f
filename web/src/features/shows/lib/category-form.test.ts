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
      'Fill in the bottom or the top of the band, or choose “Any size”.',
    ]);
    expect(await problems({ ...EMPTY_CATEGORY_VALUES, name: 'X', ruleKind: 'perimeter', minIn: '200', maxIn: '100' })).toEqual([
      'The top of the band cannot be below its bottom.',
    ]);
    expect(await problems({ ...EMPTY_CATEGORY_VALUES, name: 'X', minMakers: '0' })).toEqual(['Enter at least 1, or leave it empty.']);
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
