import { IsEmail, MaxLength } from 'class-validator';

export class ForgotPasswordDto {
  @IsEmail({}, { message: 'Enter your e-mail address, like name@example.org.' })
  @MaxLength(254, { message: 'That e-mail address is too long.' })
  email!: string;
}
