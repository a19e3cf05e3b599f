import { IsString, Length } from 'class-validator';
import { NewPassword } from './password-fields';

export class ResetPasswordDto {
  @IsString({ message: 'The link is incomplete.' })
  @Length(20, 100, { message: 'The link is incomplete; open it again from the e-mail.' })
  token!: string;

  @NewPassword()
  password!: string;
}
