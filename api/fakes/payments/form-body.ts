/**
 * Parses the form encoding the card-payment API uses for request bodies and query strings:
 * `application/x-www-form-urlencoded` pairs whose keys nest with brackets.
 *
 *   a=1                          { a: "1" }
 *   metadata[invoiceId]=12       { metadata: { invoiceId: "12" } }
 *   expand[0]=x&expand[1]=y      { expand: ["x", "y"] }
 *   expand[]=x&expand[]=y        { expand: ["x", "y"] }
 *   line_items[0][price_data][unit_amount]=2500
 *                                { line_items: [{ price_data: { unit_amount: "2500" } }] }
 *
 * Every leaf stays a string; callers convert and validate. A container whose keys are all array
 * indexes becomes an array in index order (gaps closed up). Malformed input throws FormParseError.
 */

export type FormValue = string | FormValue[] | FormObject;
export interface FormObject {
  [key: string]: FormValue;
}

export class FormParseError extends Error {
  constructor(
    message: string,
    readonly param?: string,
  ) {
    super(message);
    this.name = 'FormParseError';
  }
}

/** Nesting deeper than this is refused; the real service's deepest parameters are far shallower. */
export const MAX_DEPTH = 8;
/** Largest array index accepted, so `a[99999999]=x` cannot make a huge array. */
export const MAX_INDEX = 999;

const INDEX = /^(0|[1-9][0-9]*)$/;

/** A tree under construction: Maps keep insertion order and cannot be polluted through keys. */
type Node = Map<string, Node | string>;

function decode(text: string): string {
  try {
    return decodeURIComponent(text.replace(/\+/g, ' '));
  } catch {
    throw new FormParseError(`Invalid percent-encoding in "${text}"`);
  }
}

/** Splits `a[b][]` into ["a", "b", ""]. */
export function splitKey(key: string): string[] {
  const open = key.indexOf('[');
  if (open === -1) return [key];
  const root = key.slice(0, open);
  if (root === '') throw new FormParseError(`Invalid parameter name "${key}"`);
  const segments = [root];
  let rest = key.slice(open);
  while (rest.length > 0) {
    const match = /^\[([^[\]]*)\]/.exec(rest);
    if (!match) throw new FormParseError(`Invalid parameter name "${key}"`, root);
    segments.push(match[1]);
    rest = rest.slice(match[0].length);
  }
  if (segments.length - 1 > MAX_DEPTH) throw new FormParseError(`Parameter "${key}" is nested too deeply`, root);
  return segments;
}

function toValue(node: Node | string, asObject = false): FormValue {
  if (typeof node === 'string') return node;
  const keys = [...node.keys()];
  if (!asObject && keys.length > 0 && keys.every((k) => INDEX.test(k))) {
    return keys
      .map(Number)
      .sort((a, b) => a - b)
      .map((i) => toValue(node.get(String(i))!));
  }
  const out: FormObject = {};
  for (const key of keys) {
    // defineProperty so a key such as "__proto__" stays an ordinary own property.
    Object.defineProperty(out, key, { value: toValue(node.get(key)!), enumerable: true, writable: true, configurable: true });
  }
  return out;
}

/** Parses a whole body or query string (without the leading "?"). */
export function parseForm(text: string): FormObject {
  const root: Node = new Map();
  for (const pair of text.split('&')) {
    if (pair === '') continue;
    const eq = pair.indexOf('=');
    const rawKey = eq === -1 ? pair : pair.slice(0, eq);
    const rawValue = eq === -1 ? '' : pair.slice(eq + 1);
    const key = decode(rawKey);
    const value = decode(rawValue);
    const segments = splitKey(key);
    const path = segments[0];

    let node = root;
    for (let i = 0; i < segments.length; i++) {
      let segment = segments[i];
      const last = i === segments.length - 1;
      if (segment === '') segment = String(node.size); // `[]` appends
      if (i > 0 && INDEX.test(segment) && Number(segment) > MAX_INDEX) {
        throw new FormParseError(`Array index in "${key}" is too large`, path);
      }
      const existing = node.get(segment);
      if (last) {
        if (existing instanceof Map) throw new FormParseError(`Parameter "${key}" is both a value and an object`, path);
        node.set(segment, value); // a repeated plain key keeps the last value
      } else {
        if (typeof existing === 'string') {
          throw new FormParseError(`Parameter "${key}" is both a value and an object`, path);
        }
        let child = existing;
        if (!child) {
          child = new Map();
          node.set(segment, child);
        }
        node = child;
      }
    }
  }
  return toValue(root, true) as FormObject;
}
