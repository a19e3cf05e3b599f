import { IsNotEmpty, IsString } from 'class-validator';
import { BadRequestException } from '@nestjs/common';
import { createValidationPipe } from '../pipes/validation';
import { CleanText, OmitOrGive, cleanText } from './text';

class Form {
  @CleanText()
  @IsString({ message: 'Give it a name.' })
  @IsNotEmpty({ message: 'Give it a name.' })
  name!: string;

  @OmitOrGive()
  @CleanText()
  @IsString({ message: 'Write the note as text.' })
  note?: string;
}

const run = (value: unknown) => createValidationPipe().transform(value, { type: 'body', metatype: Form });
const errorsOf = (value: unknown) =>
  run(value).then(
    () => null,
    (e: BadRequestException) => (e.getResponse() as { errors: Record<string, string[]> }).errors,
  );

describe('text fields', () => {
  it('trims and drops control characters, in lists too', () => {
    expect(cleanText('  Wren\u0000 Song\u0007 ')).toBe('Wren Song');
    expect(cleanText('line one\nline two\t')).toBe('line one\nline two');
    expect(cleanText([' a ', 3])).toEqual(['a', 3]);
    expect(cleanText(null)).toBeNull();
  });

  it('refuses a name of spaces only, and a null where the field may only be left out', async () => {
    expect(await errorsOf({ name: '   ' })).toEqual({ name: ['Give it a name.'] });
    expect(await errorsOf({ name: 'Ok', note: null })).toEqual({ note: ['Write the note as text.'] });
    expect(await errorsOf({ name: 'Ok' })).toBeNull();
    expect(await run({ name: '  Ok  ', note: ' n ' })).toMatchObject({ name: 'Ok', note: 'n' });
  });
});
