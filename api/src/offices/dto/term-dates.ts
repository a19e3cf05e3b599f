import { ValidateBy, type ValidationOptions } from 'class-validator';
import { isIsoDate } from '../terms';

/** A real calendar date as YYYY-MM-DD. */
export const IsCalendarDate = (message: string, options?: ValidationOptions) =>
  ValidateBy({ name: 'isCalendarDate', validator: { validate: (v: unknown) => isIsoDate(v), defaultMessage: () => message } }, options);

export const DATE_MESSAGE = 'Choose a date (year-month-day, like 2027-01-01).';
