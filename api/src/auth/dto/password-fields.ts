import { applyDecorators } from '@nestjs/common';
import { IsString, MaxLength, MinLength } from 'class-validator';

/** A new password: long enough to resist guessing, short enough for argon2 to stay cheap. */
export const NewPassword = () =>
  applyDecorators(
    IsString({ message: 'Choose a password.' }),
    MinLength(10, { message: 'Use at least 10 characters; a short sentence is easy to remember.' }),
    MaxLength(200, { message: 'Use at most 200 characters.' }),
  );
