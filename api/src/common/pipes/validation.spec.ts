import { IsEmail, IsNotEmpty, IsString, MaxLength, ValidateNested } from 'class-validator';
import { Type } from 'class-transformer';
import { BadRequestException } from '@nestjs/common';
import { createValidationPipe, nestedDeeperThan } from './validation';

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

class Named {
  @IsString({ message: 'Give it a name.' })
  @IsNotEmpty({ message: 'Give it a name.' })
  @MaxLength(5, { message: 'Use at most 5 characters.' })
  name!: string;
}

describe('validation pipe: one clear message, and only forms', () => {
  const errorsOf = async (value: unknown) => {
    const err = await createValidationPipe()
      .transform(value, { type: 'body', metatype: Named })
      .catch((e: unknown) => e);
    expect(err).toBeInstanceOf(BadRequestException);
    return (err as BadRequestException).getResponse() as { message: string; errors?: Record<string, string[]> };
  };

  it('says what is missing, once, before any rule about length', async () => {
    expect((await errorsOf({})).errors).toEqual({ name: ['Give it a name.'] });
    expect((await errorsOf({ name: 12 })).errors).toEqual({ name: ['Give it a name.'] });
    expect((await errorsOf({ name: 'abcdefg' })).errors).toEqual({ name: ['Use at most 5 characters.'] });
  });

  it('refuses a body that is a list or a bare value, and one nested absurdly deep, without overflowing', async () => {
    expect((await errorsOf([{ name: 'ok' }])).message).toMatch(/JSON object/);
    expect((await errorsOf('name')).message).toMatch(/JSON object/);
    let deep: Record<string, unknown> = {};
    const top = { name: 'ok', extra: deep };
    for (let i = 0; i < 20_000; i++) deep = (deep.a = {}) as Record<string, unknown>;
    expect((await errorsOf(top)).message).toMatch(/nested too deeply/);
  });

  it('measures depth with its own stack', () => {
    expect(nestedDeeperThan({ a: { b: [1, { c: 2 }] } }, 3)).toBe(true);
    expect(nestedDeeperThan({ a: { b: [1, 2] } }, 3)).toBe(false);
    expect(nestedDeeperThan('text', 0)).toBe(false);
  });
});
