import { randomBytes } from 'node:crypto';

/**
 * Visitor ballot codes: 12 symbols of Crockford's Base32 (digits and capitals without I, L, O and U),
 * 5 bits each, so 60 random bits (at least 50 are needed for a code nobody can guess). Printed in
 * three groups of four ("K7QM-3XHD-9PRW"); when typed, case, spaces and dashes do not matter and the
 * look-alikes O → 0 and I, L → 1 are read the way Crockford's encoding specifies.
 */
export const CODE_ALPHABET = '0123456789ABCDEFGHJKMNPQRSTVWXYZ';
export const CODE_LENGTH = 12;
export const CODE_BITS = CODE_LENGTH * Math.log2(CODE_ALPHABET.length);

/** A fresh code from the operating system's random source (unbiased: 32 symbols take 5 bits each). */
export function generateBallotCode(random: (n: number) => Buffer = randomBytes): string {
  const bytes = random(CODE_LENGTH);
  let code = '';
  for (let i = 0; i < CODE_LENGTH; i++) code += CODE_ALPHABET[bytes[i] & 31];
  return code;
}

/** "K7QM3XHD9PRW" → "K7QM-3XHD-9PRW". */
export function formatBallotCode(code: string): string {
  return code.match(/.{1,4}/g)!.join('-');
}

/** What a person typed → the stored code, or null when it cannot be one. */
export function normaliseBallotCode(typed: string): string | null {
  if (typeof typed !== 'string' || typed.length > 64) return null;
  const text = typed
    .toUpperCase()
    .replace(/[\s\-–—_.]/g, '')
    .replace(/O/g, '0')
    .replace(/[IL]/g, '1');
  if (text.length !== CODE_LENGTH) return null;
  for (const ch of text) if (!CODE_ALPHABET.includes(ch)) return null;
  return text;
}
