import { env } from '@/config/env';

export type FieldErrors = Record<string, string[]>;

export class ApiError extends Error {
  readonly status: number;
  readonly errors: FieldErrors;

  constructor(status: number, message: string, errors: FieldErrors = {}) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.errors = errors;
  }

  get hasFieldErrors(): boolean {
    return Object.keys(this.errors).length > 0;
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

const fallbackMessages: Record<number, string> = {
  400: 'Please check the form and try again.',
  401: 'Please sign in to continue.',
  403: 'You do not have permission to do that.',
  404: 'We could not find that.',
  409: 'That clashes with something that already exists.',
  429: 'Too many attempts. Please wait a little and try again.',
};

function normaliseFieldErrors(raw: unknown): FieldErrors {
  if (!raw || typeof raw !== 'object' || Array.isArray(raw)) return {};
  const result: FieldErrors = {};
  for (const [field, value] of Object.entries(raw as Record<string, unknown>)) {
    if (Array.isArray(value)) {
      const messages = value.filter((m): m is string => typeof m === 'string');
      if (messages.length) result[field] = messages;
    } else if (typeof value === 'string') {
      result[field] = [value];
    }
  }
  return result;
}

export async function parseApiError(response: Response): Promise<ApiError> {
  let body: unknown = null;
  try {
    const text = await response.text();
    body = text ? JSON.parse(text) : null;
  } catch {
    body = null;
  }
  const record = body && typeof body === 'object' ? (body as Record<string, unknown>) : {};
  let message = record.message;
  // Some validation layers send message as a list of strings.
  if (Array.isArray(message)) message = message.filter((m) => typeof m === 'string').join(' ');
  const text =
    typeof message === 'string' && message.trim()
      ? message
      : (fallbackMessages[response.status] ?? 'Something went wrong. Please try again.');
  return new ApiError(response.status, text, normaliseFieldErrors(record.errors));
}

type RequestOptions = {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  body?: unknown;
  signal?: AbortSignal;
};

async function request<T>(path: string, { method = 'GET', body, signal }: RequestOptions = {}): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  const isForm = typeof FormData !== 'undefined' && body instanceof FormData;
  // The browser writes the multipart boundary itself.
  if (body !== undefined && !isForm) headers['Content-Type'] = 'application/json';

  let response: Response;
  try {
    response = await fetch(`${env.apiBaseUrl}${path}`, {
      method,
      headers,
      body: body === undefined ? undefined : isForm ? (body as FormData) : JSON.stringify(body),
      credentials: 'same-origin',
      signal,
    });
  } catch (error) {
    if (error instanceof DOMException && error.name === 'AbortError') throw error;
    throw new ApiError(0, 'We could not reach Selvage. Check your connection and try again.');
  }

  if (!response.ok) throw await parseApiError(response);
  if (response.status === 204) return undefined as T;
  const text = await response.text();
  return (text ? JSON.parse(text) : undefined) as T;
}

export const api = {
  get: <T>(path: string, signal?: AbortSignal) => request<T>(path, { signal }),
  post: <T>(path: string, body: unknown = {}) => request<T>(path, { method: 'POST', body }),
  put: <T>(path: string, body: unknown = {}) => request<T>(path, { method: 'PUT', body }),
  patch: <T>(path: string, body: unknown = {}) => request<T>(path, { method: 'PATCH', body }),
  delete: <T = void>(path: string) => request<T>(path, { method: 'DELETE' }),
  /** multipart/form-data, e.g. a file upload. */
  upload: <T>(path: string, form: FormData) => request<T>(path, { method: 'POST', body: form }),
};
