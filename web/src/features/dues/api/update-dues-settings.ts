import { useMutation, useQueryClient } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import { daysInMonth, MONTH_NAMES } from '../lib/format';
import { centsToInput, moneyToCents } from '../lib/money';
import { moneyField } from '../lib/money-field';
import { duesPath, duesQueryKey } from './dues-path';
import type { DuesSettings, ProrationBand } from './get-dues-settings';

export const MAX_GRACE_DAYS = 364;
export const MAX_EARLY_RENEWAL_DAYS = 180;

export type BandValues = { fromMonth: string; charge: 'full' | 'half'; coversNextYear: boolean };

/** Number boxes hold numbers once typed in (Formik), strings before. */
export type DuesSettingsValues = {
  yearStartMonth: string;
  dueMonth: string;
  dueDay: string | number;
  graceDays: string | number;
  lateFee: string;
  earlyRenewalDays: string | number;
  proration: BandValues[];
};

export type DuesSettingsInput = {
  currency: string;
  yearStartMonth: number;
  dueMonth: number;
  dueDay: number;
  graceDays: number;
  lateFeeCents: number;
  earlyRenewalDays: number;
  proration: ProrationBand[];
};

/** Position of a month in the membership year: 0 for its first month, 11 for its last. */
export const positionInYear = (month: number, startMonth: number) => (month - startMonth + 12) % 12;

const wholeNumber = (label: string, min: number, max: number) =>
  yup
    .number()
    .transform((value, original) => (typeof original === 'string' && original.trim() === '' ? undefined : value))
    .typeError(`Enter ${label} as a whole number.`)
    .required(`Enter ${label}.`)
    .integer(`Enter ${label} as a whole number.`)
    .min(min, `Enter ${label} from ${min} to ${max}.`)
    .max(max, `Enter ${label} from ${min} to ${max}.`);

const month = (required: string) =>
  yup
    .number()
    .transform((value, original) => (original === '' ? undefined : value))
    .typeError(required)
    .required(required)
    .integer(required)
    .min(1, required)
    .max(12, required);

/** The same rules the api applies, so most mistakes show before anything is sent. */
export const duesSettingsSchema = (currency: string) =>
  yup.object({
    yearStartMonth: month('Choose the month the membership year starts.'),
    dueMonth: month('Choose the month dues are due.'),
    dueDay: wholeNumber('the day', 1, 31).test('day-of-month', (value, context) => {
      const dueMonth = Number(context.parent.dueMonth);
      if (value === undefined || !(dueMonth >= 1 && dueMonth <= 12)) return true;
      const last = daysInMonth(dueMonth);
      return value <= last || context.createError({ message: `${MONTH_NAMES[dueMonth - 1]} has days 1 to ${last}.` });
    }),
    graceDays: wholeNumber('the days of grace', 0, MAX_GRACE_DAYS),
    lateFee: moneyField(currency, { required: 'Enter the late fee, or 0 for none.' }),
    earlyRenewalDays: wholeNumber('the days', 0, MAX_EARLY_RENEWAL_DAYS),
    proration: yup
      .array(
        yup.object({
          fromMonth: month('Choose the month this band starts.'),
          charge: yup.string().oneOf(['full', 'half'], 'Choose full or half dues.').required('Choose full or half dues.'),
          coversNextYear: yup.boolean(),
        }),
      )
      .test('bands-in-order', (bands, context) => {
        if (!bands || bands.length === 0) return true;
        const start = Number(context.parent.yearStartMonth);
        if (!(start >= 1 && start <= 12) || bands.some((b) => !(Number(b.fromMonth) >= 1))) return true;
        if (Number(bands[0].fromMonth) !== start)
          return context.createError({
            path: `${context.path}.0.fromMonth`,
            message: `The first band must start in ${MONTH_NAMES[start - 1]}, the first month of the membership year.`,
          });
        for (let i = 1; i < bands.length; i += 1) {
          if (positionInYear(Number(bands[i].fromMonth), start) <= positionInYear(Number(bands[i - 1].fromMonth), start))
            return context.createError({
              path: `${context.path}.${i}.fromMonth`,
              message: `Each band must start later in the membership year than the one above it (the year starts in ${MONTH_NAMES[start - 1]}).`,
            });
        }
        return true;
      }),
  });

export const toDuesSettingsValues = (settings: DuesSettings): DuesSettingsValues => ({
  yearStartMonth: String(settings.yearStartMonth),
  dueMonth: String(settings.dueMonth),
  dueDay: String(settings.dueDay),
  graceDays: String(settings.graceDays),
  lateFee: centsToInput(settings.lateFeeCents, settings.currency),
  earlyRenewalDays: String(settings.earlyRenewalDays),
  proration: settings.proration.map((b) => ({ fromMonth: String(b.fromMonth), charge: b.charge, coversNextYear: b.coversNextYear })),
});

export const toDuesSettingsInput = (values: DuesSettingsValues, currency: string): DuesSettingsInput => ({
  currency,
  yearStartMonth: Number(values.yearStartMonth),
  dueMonth: Number(values.dueMonth),
  dueDay: Number(values.dueDay),
  graceDays: Number(values.graceDays),
  lateFeeCents: moneyToCents(values.lateFee, currency),
  earlyRenewalDays: Number(values.earlyRenewalDays),
  proration: values.proration.map((b) => ({ fromMonth: Number(b.fromMonth), charge: b.charge, coversNextYear: b.coversNextYear })),
});

/** api field names that differ from the form's. */
export const SETTINGS_FIELD_MAP = { lateFeeCents: 'lateFee' } as const;

export const updateDuesSettings = (guildId: string, input: DuesSettingsInput) => api.put<DuesSettings>(`${duesPath(guildId)}/settings`, input);

export function useUpdateDuesSettings(guildId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: DuesSettingsInput) => updateDuesSettings(guildId, input),
    // Dates, quotes and statuses all follow from the settings.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: duesQueryKey(guildId) }),
  });
}
