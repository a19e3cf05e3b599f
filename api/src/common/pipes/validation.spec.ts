import { IsEmail, MaxLength, ValidateNested } from 'class-validator';
import { Type } from 'class-transformer';
import { BadRequestException } from '@nestjs/common';
import { createValidationPipe } from './validation';

class Inner {
  @MaxLength(3, { message: 'Too long.' })
  code!: string;
}
class Outer {
  @IsEmail({}, { message: 'Enter an e-mail address like name@example.org.' })
  email!: string;
  @ValidateNested()
  @Type(() => Inner)
  inner!: Inner;
}

describe('validation pipe', () => {
  it('keys messages by field, nested fields by path, and names unknown fields', async () => {
    const pipe = createValidationPipe();
    const err = await pipe
      .transform({ email: 'nope', inner: { code: 'abcd' }, extra: 1 }, { type: 'body', metatype: Outer })
      .catch((e: unknown) => e);
    expect(err).toBeInstanceOf(BadRequestException);
    const body = (err as BadRequestException).getResponse() as { errors: Record<string, string[]> };
    expect(body.errors.email).toEqual(['Enter an e-mail address like name@example.org.']);
    expect(body.errors['inner.code']).toEqual(['Too long.']);
    expect(body.errors.extra[0]).toMatch(/not a field/);
  });
});
