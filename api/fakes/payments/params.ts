/**
 * Errors in the card-payment API's JSON shape, and helpers that read request parameters (all
 * strings after form parsing) and refuse bad ones the way the API does: 400 with `code` and `param`.
 */
import type Stripe from 'stripe';
import type { FormObject, FormValue } from './form-body';

export interface RawApiError {
  type: 'invalid_request_error' | 'api_error' | 'card_error' | 'idempotency_error';
  message: string;
  code?: string;
  param?: string;
  decline_code?: string;
}

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly error: RawApiError,
  ) {
    super(error.message);
    this.name = 'ApiError';
  }
}

export function invalid(param: string | undefined, message: string, code?: string): ApiError {
  return new ApiError(400, { type: 'invalid_request_error', message, ...(code ? { code } : {}), ...(param ? { param } : {}) });
}

export function missing(param: string): ApiError {
  return invalid(param, `Missing required param: ${param}.`, 'parameter_missing');
}

export function noSuch(kind: string, id: string, param: string): ApiError {
  return new ApiError(404, {
    type: 'invalid_request_error',
    code: 'resource_missing',
    param,
    message: `No such ${kind}: '${id}'`,
  });
}

export function isObject(value: FormValue | undefined): value is FormObject {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/** Refuses keys the fake does not understand, naming the full parameter. */
export function onlyKeys(obj: FormObject, allowed: readonly string[], prefix?: string): void {
  for (const key of Object.keys(obj)) {
    if (!allowed.includes(key)) {
      const param = prefix ? `${prefix}[${key}]` : key;
      throw invalid(param, `Received unknown parameter: ${param}. The local payments fake does not support it.`, 'parameter_unknown');
    }
  }
}

/** A string parameter; empty counts as absent. */
export function optionalString(value: FormValue | undefined, param: string, maxLength = 5000): string | null {
  if (value === undefined || value === '') return null;
  if (typeof value !== 'string') throw invalid(param, `Invalid string: ${param} must be a string.`, 'parameter_invalid_string');
  if (value.length > maxLength) throw invalid(param, `Invalid string: ${param} must be at most ${maxLength} characters.`, 'parameter_invalid_string');
  return value;
}

export function requiredString(value: FormValue | undefined, param: string, maxLength = 5000): string {
  const text = optionalString(value, param, maxLength);
  if (text === null) throw missing(param);
  return text;
}

export function optionalInteger(value: FormValue | undefined, param: string): number | null {
  if (value === undefined || value === '') return null;
  if (typeof value !== 'string' || !/^-?[0-9]+$/.test(value) || !Number.isSafeInteger(Number(value))) {
    const shown = typeof value === 'string' ? value : JSON.stringify(value);
    throw invalid(param, `Invalid integer: ${shown}`, 'parameter_invalid_integer');
  }
  return Number(value);
}

export function requiredInteger(value: FormValue | undefined, param: string): number {
  const n = optionalInteger(value, param);
  if (n === null) throw missing(param);
  return n;
}

export function optionalObject(value: FormValue | undefined, param: string): FormObject | null {
  if (value === undefined || value === '') return null;
  if (!isObject(value)) throw invalid(param, `Invalid object: ${param} must be a hash of keys and values.`, 'parameter_invalid_object');
  return value;
}

export function optionalArray(value: FormValue | undefined, param: string): FormValue[] | null {
  if (value === undefined || value === '') return null;
  if (!Array.isArray(value)) throw invalid(param, `Invalid array: ${param} must be a list, e.g. ${param}[0]=...`, 'parameter_invalid_array');
  return value;
}

export const METADATA_LIMITS = { keys: 50, keyLength: 40, valueLength: 500 } as const;

/** Metadata as the API stores it: string values, empty values dropped, the documented limits kept. */
export function metadata(value: FormValue | undefined, param: string): Stripe.Metadata {
  const obj = optionalObject(value, param);
  const out: Stripe.Metadata = {};
  if (!obj) return out;
  const entries = Object.entries(obj);
  if (entries.length > METADATA_LIMITS.keys) {
    throw invalid(param, `Invalid ${param}: at most ${METADATA_LIMITS.keys} keys are allowed.`, 'parameter_invalid');
  }
  for (const [key, raw] of entries) {
    const keyParam = `${param}[${key}]`;
    if (key.length > METADATA_LIMITS.keyLength) {
      throw invalid(keyParam, `Invalid ${param}: keys must be at most ${METADATA_LIMITS.keyLength} characters.`, 'parameter_invalid');
    }
    if (typeof raw !== 'string') throw invalid(keyParam, `Invalid ${param}: values must be strings.`, 'parameter_invalid');
    if (raw.length > METADATA_LIMITS.valueLength) {
      throw invalid(keyParam, `Invalid ${param}: values must be at most ${METADATA_LIMITS.valueLength} characters.`, 'parameter_invalid');
    }
    if (raw !== '') Object.defineProperty(out, key, { value: raw, enumerable: true, writable: true, configurable: true });
  }
  return out;
}

export function optionalUrl(value: FormValue | undefined, param: string): string | null {
  const text = optionalString(value, param, 5000);
  if (text === null) return null;
  let url: URL;
  try {
    url = new URL(text);
  } catch {
    throw invalid(param, `Not a valid URL: ${param}`, 'url_invalid');
  }
  if (url.protocol !== 'http:' && url.protocol !== 'https:') throw invalid(param, `Not a valid URL: ${param} must use http or https`, 'url_invalid');
  return text;
}

export function optionalEmail(value: FormValue | undefined, param: string): string | null {
  const text = optionalString(value, param, 800);
  if (text === null) return null;
  if (!/^[^\s@]+@[^\s@]+\.[^\s@]+$/.test(text)) throw invalid(param, `Invalid email address: ${text}`, 'email_invalid');
  return text;
}

/** The `expand` parameter as a list of dotted paths. */
export function expandList(value: FormValue | undefined): string[] {
  if (value === undefined || value === '') return [];
  const list = typeof value === 'string' ? [value] : optionalArray(value, 'expand') ?? [];
  return list.map((entry, i) => requiredString(entry, `expand[${i}]`, 500));
}
