import * as yup from 'yup';
import { centsToInput, moneyToCents, parseMoney } from '@/features/dues/lib/money';
import { moneyField } from '@/features/dues/lib/money-field';
import type { Category, Entry } from '../api/types';
import { checkInches } from '@/lib/inches';
import { cleanMakers, makersProblem, readSize, sizeProblem } from './size-rule';

/** The api's limits on an entry (EntryDto). */
export const STORY_MAX = 1000;
export const TITLE_MAX = 160;
export const MAKERS_MAX = 30;
export const NAME_MAX = 120;
export const TECHNIQUES_MAX = 300;
export const QUILT_MIN_IN = 4;
export const QUILT_MAX_IN = 200;
const PRICE_MAX_CENTS = 10_000_000;

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
  quilter?: string;
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

type SchemaCategory = Pick<Category, 'id' | 'name' | 'minMakers'> & Partial<Pick<Category, 'sizeRule'>>;

/** The api refuses a quilt its category's rule does not take, so she is told before sending. */
const inchesField = (what: string, side: 'widthIn' | 'heightIn', categories: readonly SchemaCategory[]) =>
  yup
    .string()
    .trim()
    .required(`Enter the ${what} in inches.`)
    .test('inches', (value, context) => {
      if (!value) return true;
      const message = checkInches(value, { min: QUILT_MIN_IN, max: QUILT_MAX_IN });
      return message ? context.createError({ message }) : true;
    })
    .test('fits', (_value, context) => {
      const parent = context.parent as EntryValues;
      const category = categories.find((c) => String(c.id) === parent.categoryId);
      const problem = sizeProblem(category?.sizeRule, readSize(parent.widthIn, parent.heightIn));
      return problem && problem.field === side ? context.createError({ message: problem.message }) : true;
    });

export const entrySchema = (currency: string, categories: readonly SchemaCategory[]) =>
  yup.object({
    categoryId: yup.string().required('Choose a category.'),
    title: yup.string().trim().required('Give the quilt a title.').max(TITLE_MAX, `Use at most ${TITLE_MAX} characters.`),
    widthIn: inchesField('width', 'widthIn', categories),
    heightIn: inchesField('height', 'heightIn', categories),
    makers: yup
      .array()
      .of(
        yup
          .string()
          .trim()
          .required('Type the maker’s name, or remove this line.')
          .max(NAME_MAX, `Use at most ${NAME_MAX} characters for each maker's name.`),
      )
      .min(1, 'Name at least one maker.')
      .test('max-makers', `List at most ${MAKERS_MAX} makers.`, (makers) => (makers ?? []).filter((m) => m && m.trim()).length <= MAKERS_MAX)
      .test('min-makers', (makers, context) => {
        const category = categories.find((c) => String(c.id) === context.parent.categoryId);
        const problem = makersProblem(category, cleanMakers(makers ?? []).length);
        return problem ? context.createError({ message: `${problem} Add the other makers.` }) : true;
      }),
    quilter: yup.string().trim().max(NAME_MAX, `Use at most ${NAME_MAX} characters.`),
    techniques: yup.string().trim().max(TECHNIQUES_MAX, `Use at most ${TECHNIQUES_MAX} characters.`),
    story: yup.string().trim().max(STORY_MAX, 'Keep the story to 1,000 characters.'),
    forSale: yup.boolean(),
    price: yup.string().when('forSale', {
      is: true,
      then: () =>
        moneyField(currency, { required: 'Enter the price, or untick “For sale”.', min: 1, minMessage: 'The price must be more than 0.' }).test(
          'price-max',
          `The price can be at most ${centsToInput(PRICE_MAX_CENTS, currency)}.`,
          (value) => {
            const parsed = value ? parseMoney(value, currency) : null;
            return !parsed?.ok || parsed.cents <= PRICE_MAX_CENTS;
          },
        ),
      otherwise: (s) => s,
    }),
    onBehalfOf: yup.string(),
  });

const names = (makers: readonly string[]) => makers.map((m) => m.trim()).filter(Boolean);

/** A new entry's body. Empty optional texts are left out; the price only goes with "for sale". */
export function toEntryInput(values: EntryValues, currency: string): EntryInput {
  const quilter = values.quilter.trim();
  const techniques = values.techniques.trim();
  const story = values.story.trim();
  return {
    categoryId: Number(values.categoryId),
    title: values.title.trim(),
    widthIn: values.widthIn.trim(),
    heightIn: values.heightIn.trim(),
    makers: names(values.makers),
    ...(quilter ? { quilter } : {}),
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
