import { BadRequestException, ValidationError, ValidationPipe } from '@nestjs/common';

/** Flattens class-validator's tree into `{ "field.path": ["message"] }` for forms. */
export function fieldErrors(errors: ValidationError[], parent = ''): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const error of errors) {
    const path = parent ? `${parent}.${error.property}` : error.property;
    if (error.constraints) {
      out[path] = Object.entries(error.constraints).map(([rule, message]) =>
        rule === 'whitelistValidation' ? `“${error.property}” is not a field this form accepts.` : message,
      );
    }
    if (error.children?.length) Object.assign(out, fieldErrors(error.children, path));
  }
  return out;
}

export function createValidationPipe(): ValidationPipe {
  return new ValidationPipe({
    whitelist: true,
    forbidNonWhitelisted: true,
    transform: true,
    stopAtFirstError: false,
    exceptionFactory: (errors) =>
      new BadRequestException({ message: 'Please check the highlighted fields.', errors: fieldErrors(errors) }),
  });
}
