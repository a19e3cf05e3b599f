import { ApiProperty } from '@nestjs/swagger';
import { IsEmail, IsNotEmpty, IsString, MaxLength } from 'class-validator';
import { NewPassword } from '../../auth/dto/password-fields';

export class UpdateProfileDto {
  @ApiProperty()
  @IsString({ message: 'Enter your name.' })
  @IsNotEmpty({ message: 'Enter your name.' })
  @MaxLength(120, { message: 'Use at most 120 characters.' })
  name!: string;
}

export class ChangeEmailDto {
  @ApiProperty()
  @IsEmail({}, { message: 'Enter an e-mail address, like name@example.org.' })
  @MaxLength(254, { message: 'That e-mail address is too long.' })
  email!: string;

  @ApiProperty()
  @IsString({ message: 'Enter your current password.' })
  @IsNotEmpty({ message: 'Enter your current password.' })
  @MaxLength(200, { message: 'That password is too long.' })
  currentPassword!: string;
}

export class ChangePasswordDto {
  @ApiProperty()
  @IsString({ message: 'Enter your current password.' })
  @IsNotEmpty({ message: 'Enter your current password.' })
  @MaxLength(200, { message: 'That password is too long.' })
  currentPassword!: string;

  @ApiProperty()
  @NewPassword()
  newPassword!: string;
}
