import * as yup from 'yup';
import type { Category } from '../api/types';
import { checkInches, inchesOrNull, inchesToStoredMm } from '@/lib/inches';
import { mmToInchText } from './size-rule';

export type RuleKind = 'none' | 'dimensions' | 'perimeter';

export type CategoryValues = {
  name: string;
  description: string;
  judged: 'judged' | 'exhibit';
  minMakers: string | number;
  maxEntriesPerMember: string | number;
  ruleKind: RuleKind;
  minWidthIn: string;
  maxWidthIn: string;
  minHeightIn: string;
  maxHeightIn: string;
  /** Perimeter band: "true" for at least / at most, "false" for more than / less than. */
  minIn: string;
  minInclusive: 'true' | 'false';
  maxIn: string;
  maxInclusive: 'true' | 'false';
};

/** Inches travel as text; the api reads them as it reads entries. */
export type SizeRuleInput =
  | { kind: 'none' }
  | { kind: 'dimensions'; maxWidthIn?: string; maxHeightIn?: string; minWidthIn?: string; minHeightIn?: string }
  | { kind: 'perimeter'; minIn?: string; minInclusive?: boolean; maxIn?: string; maxInclusive?: boolean };

export type CategoryInput = {
  name: string;
  description?: string;
  judged: boolean;
  sizeRule: SizeRuleInput;
  minMakers?: number | null;
  maxEntriesPerMember?: number | null;
  sortOrder?: number;
};

export const CATEGORY_FIELD_MAP = {
  sizeRule: 'ruleKind',
  'sizeRule.kind': 'ruleKind',
  'sizeRule.minWidthIn': 'minWidthIn',
  'sizeRule.maxWidthIn': 'maxWidthIn',
  'sizeRule.minHeightIn': 'minHeightIn',
  'sizeRule.maxHeightIn': 'maxHeightIn',
  'sizeRule.minIn': 'minIn',
  'sizeRule.maxIn': 'maxIn',
} as const;

export const RULE_KIND_OPTIONS = [
  { value: 'none', label: 'Any size' },
  { value: 'dimensions', label: 'Limits on width and height' },
  { value: 'perimeter', label: 'Perimeter (the distance around the quilt)' },
] as const;

export const JUDGED_OPTIONS = [
  { value: 'judged', label: 'Judged' },
  { value: 'exhibit', label: 'Exhibit only (not judged)' },
] as const;

export const MIN_BOUND_OPTIONS = [
  { value: 'true', label: 'at least' },
  { value: 'false', label: 'more than' },
] as const;

export const MAX_BOUND_OPTIONS = [
  { value: 'true', label: 'at most' },
  { value: 'false', label: 'less than' },
] as const;

export const EMPTY_CATEGORY_VALUES: CategoryValues = {
  name: '',
  description: '',
  judged: 'judged',
  minMakers: '',
  maxEntriesPerMember: '',
  ruleKind: 'none',
  minWidthIn: '',
  maxWidthIn: '',
  minHeightIn: '',
  maxHeightIn: '',
  minIn: '',
  minInclusive: 'true',
  maxIn: '',
  maxInclusive: 'true',
};

const inch = (mm: number | null) => (mm == null ? '' : mmToInchText(mm));

export function toCategoryValues(category: Category): CategoryValues {
  const rule = category.sizeRule;
  return {
    ...EMPTY_CATEGORY_VALUES,
    name: category.name,
    description: category.description,
    judged: category.judged ? 'judged' : 'exhibit',
    minMakers: category.minMakers == null ? '' : String(category.minMakers),
    maxEntriesPerMember: category.maxEntriesPerMember == null ? '' : String(category.maxEntriesPerMember),
    ruleKind: rule.kind,
    ...(rule.kind === 'dimensions'
      ? { minWidthIn: inch(rule.minWidthMm), maxWidthIn: inch(rule.maxWidthMm), minHeightIn: inch(rule.minHeightMm), maxHeightIn: inch(rule.maxHeightMm) }
      : {}),
    ...(rule.kind === 'perimeter'
      ? { minIn: inch(rule.minMm), minInclusive: rule.minInclusive ? 'true' : 'false', maxIn: inch(rule.maxMm), maxInclusive: rule.maxInclusive ? 'true' : 'false' }
      : {}),
  };
}

const blank = (value: string | number | null | undefined) => value == null || String(value).trim() === '';
/** Stored millimetres, as the api compares limits; null when empty or unreadable. */
const mmOf = (value: string | undefined) => {
  const inches = blank(value) ? null : inchesOrNull(value);
  return inches === null ? null : inchesToStoredMm(inches);
};

/** The api's limits on a category (CategoryDto, SizeRuleDto). */
export const CATEGORY_NAME_MAX = 80;
export const CATEGORY_DESCRIPTION_MAX = 500;
const SIDE_MAX_IN = 600;
const PERIMETER_MAX_IN = 2400;
const MIN_MAKERS_MESSAGE = 'Enter the least number of makers (2 to 50), or leave it empty.';
const MAX_ENTRIES_MESSAGE = 'Enter a whole number of quilts from 1 to 50, or leave it empty for no limit.';

/** Optional inch text, read and limited as the api does; only the chosen rule's limits are sent. */
const inchField = (kind: RuleKind, max: number) =>
  yup
    .string()
    .trim()
    .test('inches', (value, context) => {
      if (blank(value) || (context.parent as CategoryValues).ruleKind !== kind) return true;
      const message = checkInches(value, { max });
      return message ? context.createError({ message }) : true;
    });

const count = (min: number, max: number, message: string) =>
  yup
    .number()
    .transform((value, original) => (blank(original) ? undefined : value))
    .typeError(message)
    .integer(message)
    .min(min, message)
    .max(max, message);

/** The api allows equal limits on a side (a quilt exactly that size), but not the least above the greatest. */
const notAbove = (other: string, message: string) =>
  function test(this: yup.TestContext, value: string | undefined) {
    const lower = mmOf(value);
    const upper = mmOf(this.parent[other]);
    return lower === null || upper === null || lower <= upper || this.createError({ message });
  };

const ruleIs = (kind: RuleKind) => (p: CategoryValues) => p.ruleKind === kind;
const onlyFor = (kind: RuleKind, test: (this: yup.TestContext, value: string | undefined) => boolean | yup.ValidationError) =>
  function check(this: yup.TestContext, value: string | undefined) {
    return !ruleIs(kind)(this.parent as CategoryValues) || test.call(this, value);
  };

export const categorySchema = yup.object({
  name: yup.string().trim().required('Name the category.').max(CATEGORY_NAME_MAX, `Use at most ${CATEGORY_NAME_MAX} characters.`),
  description: yup.string().trim().max(CATEGORY_DESCRIPTION_MAX, `Use at most ${CATEGORY_DESCRIPTION_MAX} characters.`),
  judged: yup.string().oneOf(['judged', 'exhibit']).required(),
  minMakers: count(2, 50, MIN_MAKERS_MESSAGE),
  maxEntriesPerMember: count(1, 50, MAX_ENTRIES_MESSAGE),
  ruleKind: yup.string().oneOf(['none', 'dimensions', 'perimeter']).required('Choose a size rule.'),
  minWidthIn: inchField('dimensions', SIDE_MAX_IN).test('order', onlyFor('dimensions', notAbove('maxWidthIn', 'The least width is more than the greatest.'))),
  maxWidthIn: inchField('dimensions', SIDE_MAX_IN).test(
    'some-limit',
    'Give at least one width or height limit, or choose “Any size”.',
    onlyFor('dimensions', function someLimit() {
      const p = this.parent as CategoryValues;
      return [p.minWidthIn, p.maxWidthIn, p.minHeightIn, p.maxHeightIn].some((v) => !blank(v));
    }),
  ),
  minHeightIn: inchField('dimensions', SIDE_MAX_IN).test('order', onlyFor('dimensions', notAbove('maxHeightIn', 'The least height is more than the greatest.'))),
  maxHeightIn: inchField('dimensions', SIDE_MAX_IN),
  minIn: inchField('perimeter', PERIMETER_MAX_IN).test(
    'order',
    onlyFor('perimeter', function order(value) {
      const lower = mmOf(value);
      const upper = mmOf(this.parent.maxIn);
      // The api refuses ends that meet, even "at least 100" with "at most 100".
      return lower === null || upper === null || lower < upper || this.createError({ message: 'The lower perimeter must be less than the upper one.' });
    }),
  ),
  minInclusive: yup.string(),
  maxIn: inchField('perimeter', PERIMETER_MAX_IN).test(
    'some-limit',
    'Give a lower or an upper perimeter, or choose “Any size”.',
    onlyFor('perimeter', function someLimit() {
      const p = this.parent as CategoryValues;
      return !blank(p.minIn) || !blank(p.maxIn);
    }),
  ),
  maxInclusive: yup.string(),
});

export function toSizeRuleInput(values: CategoryValues): SizeRuleInput {
  const t = (value: string) => (blank(value) ? undefined : value.trim());
  if (values.ruleKind === 'dimensions') {
    const limits = {
      minWidthIn: t(values.minWidthIn),
      maxWidthIn: t(values.maxWidthIn),
      minHeightIn: t(values.minHeightIn),
      maxHeightIn: t(values.maxHeightIn),
    };
    // Only the limits she filled in.
    return { kind: 'dimensions', ...Object.fromEntries(Object.entries(limits).filter(([, v]) => v !== undefined)) };
  }
  if (values.ruleKind === 'perimeter') {
    return {
      kind: 'perimeter',
      ...(blank(values.minIn) ? {} : { minIn: values.minIn.trim(), minInclusive: values.minInclusive === 'true' }),
      ...(blank(values.maxIn) ? {} : { maxIn: values.maxIn.trim(), maxInclusive: values.maxInclusive === 'true' }),
    };
  }
  return { kind: 'none' };
}

/** The api body; a new category leaves empty limits out, a change sends null to clear them. */
export function toCategoryInput(values: CategoryValues, { create, sortOrder }: { create: boolean; sortOrder?: number }): CategoryInput {
  const number = (value: string | number) => (blank(value) ? null : Number(value));
  const input: CategoryInput = {
    name: values.name.trim(),
    description: values.description.trim(),
    judged: values.judged === 'judged',
    sizeRule: toSizeRuleInput(values),
    minMakers: number(values.minMakers),
    maxEntriesPerMember: number(values.maxEntriesPerMember),
  };
  if (create) {
    if (!input.description) delete input.description;
    if (input.minMakers === null) delete input.minMakers;
    if (input.maxEntriesPerMember === null) delete input.maxEntriesPerMember;
    if (sortOrder !== undefined) input.sortOrder = sortOrder;
  }
  return input;
}

/**
 * The four usual perimeter bands. The published bands leave a perimeter between 240 and 241 in
 * undecided; here Medium ends at 240 and Large takes anything over it.
 */
export const USUAL_SIZE_CATEGORIES: readonly CategoryInput[] = [
  { name: 'Small', judged: true, sizeRule: { kind: 'perimeter', maxIn: '160', maxInclusive: false } },
  { name: 'Medium', judged: true, sizeRule: { kind: 'perimeter', minIn: '160', minInclusive: true, maxIn: '240', maxInclusive: true } },
  { name: 'Large', judged: true, sizeRule: { kind: 'perimeter', minIn: '240', minInclusive: false, maxIn: '320', maxInclusive: true } },
  { name: 'Extra large', judged: true, sizeRule: { kind: 'perimeter', minIn: '320', minInclusive: false } },
];

/** The usual categories this show does not have yet (by name, ignoring case), numbered after the others. */
export function missingUsualCategories(existing: readonly Pick<Category, 'name' | 'sortOrder'>[]): CategoryInput[] {
  const names = new Set(existing.map((c) => c.name.trim().toLowerCase()));
  const start = existing.reduce((max, c) => Math.max(max, c.sortOrder), 0);
  return USUAL_SIZE_CATEGORIES.filter((c) => !names.has(c.name.toLowerCase())).map((c, i) => ({ ...c, sortOrder: start + i + 1 }));
}
