/** Every card's code is 12 letters and digits (60 random bits), so a short one can be told before asking the api. */
export const BALLOT_CODE_LENGTH = 12;

/**
 * A ballot card's code as typed: any case, with or without spaces and dashes. "k7qm 3xhd-9prw" →
 * "K7QM3XHD9PRW". The api reads look-alike letters itself and says when a code is unknown.
 */
export function normaliseBallotCode(typed: string): string {
  return typed.toUpperCase().replace(/[\s\-‐‑–—_.]/g, '');
}

/** "K7QM3XHD9PRW" → "K7QM-3XHD-9PRW", the way the cards print it. */
export function formatBallotCode(code: string): string {
  return (normaliseBallotCode(code).match(/.{1,4}/g) ?? []).join('-');
}
