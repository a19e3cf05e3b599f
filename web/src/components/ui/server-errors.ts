import { setIn, type FormikErrors, type FormikHelpers } from 'formik';
import { isApiError } from '@/lib/api-client';

export type FormStatus = { error?: string; success?: string } | undefined;

type Helpers<T> = Pick<FormikHelpers<T>, 'setErrors' | 'setStatus'>;

/**
 * Shows a failed request on a Formik form: field errors from the api's `errors` map go inline
 * (under the matching field), the general message goes in the form's alert.
 * `fieldMap` renames api fields to form fields where they differ. Nested api paths such as
 * `swatches.0.name` go under the matching nested field when its first part is a form field.
 */
export function applyServerErrors<T extends object>(
  error: unknown,
  helpers: Helpers<T>,
  values: T,
  fieldMap: Partial<Record<string, keyof T & string>> = {},
): void {
  if (!isApiError(error)) {
    helpers.setStatus({ error: 'Something went wrong. Please try again.' } satisfies FormStatus);
    return;
  }
  const formFields = new Set(Object.keys(values));
  let fieldErrors: Record<string, unknown> = {};
  const unplaced: string[] = [];
  for (const [apiField, messages] of Object.entries(error.errors)) {
    const field = fieldMap[apiField] ?? apiField;
    const root = field.split(/[.[]/)[0];
    if (formFields.has(field)) fieldErrors[field] = messages.join(' ');
    else if (root !== field && formFields.has(root)) fieldErrors = setIn(fieldErrors, field, messages.join(' '));
    else unplaced.push(...messages);
  }
  helpers.setErrors(fieldErrors as FormikErrors<T>);
  const message = [error.message, ...unplaced].filter(Boolean).join(' ');
  helpers.setStatus({ error: message } satisfies FormStatus);
}
