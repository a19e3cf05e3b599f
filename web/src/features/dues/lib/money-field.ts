import * as yup from 'yup';
import { parseMoney } from './money';

/** A typed amount checked the way the api will read it (see parseMoney). */
export function moneyField(currency: string, { required = 'Enter an amount.', min = 0, minMessage }: { required?: string; min?: number; minMessage?: string } = {}) {
  return yup
    .string()
    .trim()
    .required(required)
    .test('money', (value, context) => {
      if (!value) return true;
      const parsed = parseMoney(value, currency);
      if (!parsed.ok) return context.createError({ message: parsed.message });
      if (parsed.cents < min) return context.createError({ message: minMessage ?? 'The amount is too small.' });
      return true;
    });
}
