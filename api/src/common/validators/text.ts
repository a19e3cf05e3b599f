import { Transform } from 'class-transformer';
import { ValidateIf } from 'class-validator';

// Control characters other than tab and newline: invisible, and they break CSV, PDF and e-mail output.
const CONTROL = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F]/g;

/** Text as the person meant it: control characters dropped, spaces trimmed (so "   " is empty and fails @IsNotEmpty). */
export function cleanText(value: unknown): unknown {
  if (typeof value === 'string') return value.replace(CONTROL, '').trim();
  if (Array.isArray(value)) return value.map((v) => (typeof v === 'string' ? v.replace(CONTROL, '').trim() : v));
  return value;
}

/** Cleans a text field (or a list of them) before it is validated. */
export const CleanText = () => Transform(({ value }) => cleanText(value));

/**
 * The field may be left out, but when it is sent it must be valid: null is refused by the field's own
 * rules instead of reaching the service as a value it cannot use. (@IsOptional lets null through.)
 */
export const OmitOrGive = () => ValidateIf((_, value) => value !== undefined);
