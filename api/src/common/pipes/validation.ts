import { type ArgumentMetadata, BadRequestException, ValidationError, ValidationPipe } from '@nestjs/common';

/**
 * Rules that say what a field is (present, text, a number, a list…) come before rules about its
 * size or form: a missing name should read "Give the show a name.", not "Use at most 120 characters.".
 */
const FIRST_RULES = [
  'whitelistValidation',
  'isDefined',
  'isString',
  'isNotEmpty',
  'isInt',
  'isNumber',
  'isBoolean',
  'isArray',
  'isObject',
  'isIso8601',
  'isIn',
  'isEnum',
];

function rulePriority(rule: string): number {
  const i = FIRST_RULES.indexOf(rule);
  return i === -1 ? FIRST_RULES.length : i;
}

/**
 * Flattens class-validator's tree into `{ "field.path": ["message"] }` for forms: one message per
 * field, the one that tells the person what to do first.
 */
export function fieldErrors(errors: ValidationError[], parent = ''): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const error of errors) {
    const path = parent ? `${parent}.${error.property}` : error.property;
    if (error.constraints) {
      const [rule, message] = Object.entries(error.constraints).sort(([a], [b]) => rulePriority(a) - rulePriority(b))[0];
      out[path] = [rule === 'whitelistValidation' ? `“${error.property}” is not a field this form accepts.` : message];
    }
    if (error.children?.length && !out[path]) Object.assign(out, fieldErrors(error.children, path));
  }
  return out;
}

/** Deeper than any form we take; a body nested thousands deep would exhaust the stack while being checked. */
export const MAX_BODY_DEPTH = 32;

/** Whether a parsed JSON value nests deeper than `limit` (walked with an explicit stack, so it cannot overflow). */
export function nestedDeeperThan(value: unknown, limit: number): boolean {
  const stack: [unknown, number][] = [[value, 0]];
  while (stack.length) {
    const [v, depth] = stack.pop()!;
    if (v === null || typeof v !== 'object') continue;
    if (depth >= limit) return true;
    for (const child of Object.values(v as object)) stack.push([child, depth + 1]);
  }
  return false;
}

/** A form's body must be a plain JSON object of sane depth; no body at all is an empty form (the DTO then names what is missing). */
export function assertFormBody(value: unknown): void {
  if (value != null && (typeof value !== 'object' || Array.isArray(value)))
    throw new BadRequestException('Send the form’s fields as a JSON object, like {"name": "…"}.');
  if (nestedDeeperThan(value, MAX_BODY_DEPTH)) throw new BadRequestException('The request body is nested too deeply to be a form.');
}

/** The global pipe: whitelisted DTOs, one message per field, and a body that is a form. */
class SelvageValidationPipe extends ValidationPipe {
  override async transform(value: unknown, metadata: ArgumentMetadata): Promise<unknown> {
    if (metadata.type === 'body' && metadata.metatype && this.toValidate(metadata)) assertFormBody(value);
    return super.transform(value, metadata);
  }
}

export function createValidationPipe(): ValidationPipe {
  return new SelvageValidationPipe({
    whitelist: true,
    forbidNonWhitelisted: true,
    transform: true,
    stopAtFirstError: false,
    exceptionFactory: (errors) => new BadRequestException({ message: 'Please check the highlighted fields.', errors: fieldErrors(errors) }),
  });
}
