import * as yup from 'yup';
import { centsToInput, moneyToCents } from '@/features/dues/lib/money';
import { moneyField } from '@/features/dues/lib/money-field';
import { parseInches } from '@/lib/inches';
import type { Category, Entry } from '../api/types';

export const STORY_MAX = 1000;

export type EntryValues = {
  categoryId: string;
  title: string;
  widthIn: string;
  heightIn: string;
  makers: string[];
  quilter: string;
  techniques: string;
  story: string;
  forSale: boolean;
  price: string;
  /** Chairs only: the membership id of the member she enters for; empty for herself. */
  onBehalfOf: string;
};

export type EntryInput = {
  categoryId: number;
  title: string;
  widthIn: string;
  heightIn: string;
  makers: string[];
  quilter: string;
  techniques?: string;
  story?: string;
  forSale: boolean;
  priceCents?: number | null;
  onBehalfOf?: number;
};

/** The api's field names that differ from the form's. */
export const ENTRY_FIELD_MAP = { priceCents: 'price' } as const;

export function emptyEntryValues(makerName: string, categories: readonly Pick<Category, 'id'>[]): EntryValues {
  return {
    categoryId: categories.length === 1 ? String(categories[0].id) : '',
    title: '',
    widthIn: '',
    heightIn: '',
    makers: [makerName],
    quilter: '',
    techniques: '',
    story: '',
    forSale: false,
    price: '',
    onBehalfOf: '',
  };
}

export function toEntryValues(entry: Entry, currency: string): EntryValues {
  return {
    categoryId: String(entry.categoryId),
    title: entry.title,
    widthIn: entry.widthText,
    heightIn: entry.heightText,
    makers: entry.makers.length ? [...entry.makers] : [''],
    quilter: entry.quilter,
    techniques: entry.techniques,
    story: entry.story,
    forSale: entry.forSale,
    price: entry.forSale ? centsToInput(entry.priceCents, currency) : '',
    onBehalfOf: '',
  };
}

const inchesField = (what: string) =>
  yup
    .string()
    .trim()
    .required(`Enter the ${what} in inches.`)
    .test('inches', `Type the ${what} in inches, like 60, 60 1/2 or 60.5.`, (value) => {
      if (!value) return true;
      const inches = parseInches(value);
      return inches !== null && inches > 0;
    });

export const entrySchema = (currency: string, categories: readonly Pick<Category, 'id' | 'name' | 'minMakers'>[]) =>
  yup.object({
    categoryId: yup.string().required('Choose a category.'),
    title: yup.string().trim().required('Give your quilt a title.'),
    widthIn: inchesField('width'),
    heightIn: inchesField('height'),
    makers: yup
      .array()
      .of(yup.string().trim().required('Type the maker’s name, or remove this line.'))
      .min(1, 'Name at least one maker.')
      .test('min-makers', (makers, context) => {
        const category = categories.find((c) => String(c.id) === context.parent.categoryId);
        const needed = category?.minMakers ?? 0;
        const named = (makers ?? []).filter((m) => m && m.trim()).length;
        if (needed > 1 && named < needed)
          return context.createError({ message: `${category?.name} is for quilts made by at least ${needed} people. Add the other makers.` });
        return true;
      }),
    quilter: yup.string().trim().required('Say who quilted it. If it was you, type your own name.'),
    techniques: yup.string().trim(),
    story: yup.string().max(STORY_MAX, `Keep the story to ${STORY_MAX} characters.`),
    forSale: yup.boolean(),
    price: yup.string().when('forSale', {
      is: true,
      then: () => moneyField(currency, { required: 'Enter the price, or untick “For sale”.', min: 1, minMessage: 'The price must be more than 0.' }),
      otherwise: (s) => s,
    }),
    onBehalfOf: yup.string(),
  });

const names = (makers: readonly string[]) => makers.map((m) => m.trim()).filter(Boolean);

/** A new entry's body. Empty optional texts are left out; the price only goes with "for sale". */
export function toEntryInput(values: EntryValues, currency: string): EntryInput {
  const techniques = values.techniques.trim();
  const story = values.story.trim();
  return {
    categoryId: Number(values.categoryId),
    title: values.title.trim(),
    widthIn: values.widthIn.trim(),
    heightIn: values.heightIn.trim(),
    makers: names(values.makers),
    quilter: values.quilter.trim(),
    ...(techniques ? { techniques } : {}),
    ...(story ? { story } : {}),
    forSale: values.forSale,
    ...(values.forSale ? { priceCents: moneyToCents(values.price, currency) } : {}),
    ...(values.onBehalfOf ? { onBehalfOf: Number(values.onBehalfOf) } : {}),
  };
}

/**
 * The body of a change to an entry: every field she can edit (emptied texts as ""), the price null
 * when it is no longer for sale, and the category only when it changed.
 */
export function toEntryPatch(values: EntryValues, currency: string, entry: Pick<Entry, 'categoryId'>): Partial<EntryInput> {
  const patch: Partial<EntryInput> = {
    title: values.title.trim(),
    widthIn: values.widthIn.trim(),
    heightIn: values.heightIn.trim(),
    makers: names(values.makers),
    quilter: values.quilter.trim(),
    techniques: values.techniques.trim(),
    story: values.story.trim(),
    forSale: values.forSale,
    priceCents: values.forSale ? moneyToCents(values.price, currency) : null,
  };
  if (Number(values.categoryId) !== entry.categoryId) patch.categoryId = Number(values.categoryId);
  return patch;
}
