import { ValidateBy } from 'class-validator';

/** A database id in a request body: a whole number above 0, with one message for anything else. */
export const IsId = (message: string) =>
  ValidateBy({ name: 'isId', validator: { validate: (v: unknown) => Number.isSafeInteger(v) && (v as number) > 0, defaultMessage: () => message } });
