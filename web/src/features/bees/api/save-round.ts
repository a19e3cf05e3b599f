import { useMutation, useQueryClient } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import { parseInches } from '@/lib/inches';
import { beeQueryOptions } from './get-bee';
import {
  roundPath,
  roundQueryOptions,
  mergeRoundResponse,
  type DeliveryMethod,
  type FabricSource,
  type Round,
  type RoundPage,
  type Swatch,
  type TrimMode,
} from './get-round';

export const MAX_SWATCHES = 12;
export const SIZE_PRESETS = ['6', '8', '9', '10', '12', '16'] as const;

export type RoundFormValues = {
  title: string;
  instructions: string;
  patternLink: string;
  finishedWidth: string;
  finishedHeight: string;
  seamAllowance: string;
  tolerance: string;
  trimMode: TrimMode;
  swatches: Swatch[];
  background: Swatch | null;
  fabricSource: FabricSource;
  dueDate: string;
  sendDate: string;
  sendTime: string;
  deliveryMethod: DeliveryMethod;
  deliveryAddress: string;
  meetingDetails: string;
};

export type RoundInput = {
  title: string;
  instructions: string;
  patternLink?: string;
  finishedWidth: string;
  finishedHeight: string;
  seamAllowance?: string;
  tolerance?: string;
  trimMode: TrimMode;
  swatches: Swatch[];
  background: Swatch | null;
  fabricSource: FabricSource;
  dueDate: string;
  sendDate?: string;
  sendTime?: string;
  deliveryMethod: DeliveryMethod;
  deliveryAddress?: string;
  meetingDetails?: string;
};

const inches = (message: string) =>
  yup
    .string()
    .trim()
    .test('inches', message, (value) => !value || (parseInches(value) ?? 0) > 0);

const hex = yup
  .string()
  .required('Choose a colour.')
  .matches(/^#[0-9a-fA-F]{6}$/, 'Choose a colour.');

const swatch = yup.object({
  name: yup.string().trim().required('Name the colour, for example “sky blue”.').max(60, 'Keep the name under 60 characters.'),
  hex,
});

const DATE = /^\d{4}-\d{2}-\d{2}$/;

// Loose on purpose: the api parses sizes and dates and has the last word.
export const roundSchema = yup.object({
  title: yup.string().trim().required('Give the block a title.').max(120, 'Keep the title under 120 characters.'),
  instructions: yup.string().max(10000, 'Keep the instructions under 10,000 characters.'),
  patternLink: yup
    .string()
    .trim()
    .test('url', 'Enter a web address starting with http:// or https://.', (v) => !v || /^https?:\/\/\S+$/i.test(v)),
  finishedWidth: inches('Write the width in inches, like 12 or 12 1/2.').required('Enter the finished width.'),
  finishedHeight: inches('Write the height in inches, like 12 or 12 1/2.').required('Enter the finished height.'),
  seamAllowance: inches('Write the seam allowance in inches, like 1/4.'),
  tolerance: inches('Write the tolerance in inches, like 1/8.'),
  trimMode: yup.string().oneOf(['trim', 'untrimmed']).required(),
  swatches: yup.array(swatch).max(MAX_SWATCHES, `Up to ${MAX_SWATCHES} colours.`),
  background: swatch.nullable().default(null),
  fabricSource: yup.string().oneOf(['stash', 'queen_sends']).required(),
  dueDate: yup.string().required('Choose the date the blocks are due.').matches(DATE, 'Choose a date.'),
  sendDate: yup.string().test('date', 'Choose a date.', (v) => !v || DATE.test(v)),
  sendTime: yup.string().test('time', 'Choose a time, like 08:00.', (v) => !v || /^\d{2}:\d{2}$/.test(v)),
  deliveryMethod: yup.string().oneOf(['mail', 'meeting']).required(),
  deliveryAddress: yup
    .string()
    .max(1000, 'Keep the address under 1,000 characters.')
    .when('deliveryMethod', {
      is: 'mail',
      then: (schema) => schema.trim().required('Give the address makers mail their blocks to.'),
    }),
  meetingDetails: yup.string().max(1000, 'Keep the meeting details under 1,000 characters.'),
});

const cleanSwatch = (s: Swatch): Swatch => ({ name: s.name.trim(), hex: s.hex.toUpperCase() });

export function toRoundInput(values: RoundFormValues): RoundInput {
  const text = (v: string) => (v.trim() ? v.trim() : undefined);
  return {
    title: values.title.trim(),
    instructions: values.instructions,
    patternLink: text(values.patternLink),
    finishedWidth: values.finishedWidth.trim(),
    finishedHeight: values.finishedHeight.trim(),
    seamAllowance: text(values.seamAllowance),
    tolerance: text(values.tolerance),
    trimMode: values.trimMode,
    swatches: values.swatches.map(cleanSwatch),
    background: values.background ? cleanSwatch(values.background) : null,
    fabricSource: values.fabricSource,
    dueDate: values.dueDate,
    sendDate: text(values.sendDate),
    sendTime: text(values.sendTime),
    deliveryMethod: values.deliveryMethod,
    ...(values.deliveryMethod === 'mail'
      ? { deliveryAddress: text(values.deliveryAddress) }
      : { meetingDetails: text(values.meetingDetails) }),
  };
}

export const saveRound = (guildId: string, beeId: string, month: string, input: RoundInput) =>
  api.put<Round | RoundPage>(roundPath(guildId, beeId, month), input);

export function useSaveRound(guildId: string, beeId: string, month: string) {
  const queryClient = useQueryClient();
  const key = roundQueryOptions(guildId, beeId, month).queryKey;
  return useMutation({
    mutationFn: (input: RoundInput) => saveRound(guildId, beeId, month, input),
    onSuccess: async (round) => {
      queryClient.setQueryData<RoundPage>(key, (page) => mergeRoundResponse(page, round));
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: key }),
        // The rotation table shows each round's title and status.
        queryClient.invalidateQueries({ queryKey: beeQueryOptions(guildId, beeId).queryKey, exact: true }),
      ]);
    },
  });
}
