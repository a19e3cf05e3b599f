import { ApiProperty } from '@nestjs/swagger';
import { IsBoolean, IsEmail, IsNotEmpty, IsOptional, IsString, Matches, MaxLength, ValidateIf } from 'class-validator';
import { CleanText } from '../../common/validators/text';
import { NewPassword } from '../../auth/dto/password-fields';

export class UpdateProfileDto {
  @ApiProperty()
  @IsString({ message: 'Enter your name.' })
  @IsNotEmpty({ message: 'Enter your name.' })
  @MaxLength(120, { message: 'Use at most 120 characters.' })
  @CleanText()
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

/** Her contact details and which of them other members of her guilds may see. */
export class DirectoryDetailsDto {
  @ApiProperty({ nullable: true, example: '+1 555 0142' })
  @IsOptional()
  @ValidateIf((_, v) => v !== null && v !== '')
  @IsString({ message: 'Write the phone number as text.' })
  @Matches(/^\+?[0-9 ()./-]{5,40}$/, { message: 'Write a phone number with digits, spaces and + ( ) - only, like +1 555 0142.' })
  phone?: string | null;

  @ApiProperty({ nullable: true })
  @IsOptional()
  @ValidateIf((_, v) => v !== null && v !== '')
  @IsString({ message: 'Write your town as text.' })
  @MaxLength(120, { message: 'Use at most 120 characters.' })
  town?: string | null;

  @ApiProperty()
  @IsBoolean({ message: 'Say whether members may see your e-mail address.' })
  showEmail!: boolean;

  @ApiProperty()
  @IsBoolean({ message: 'Say whether members may see your phone number.' })
  showPhone!: boolean;

  @ApiProperty()
  @IsBoolean({ message: 'Say whether members may see your town.' })
  showTown!: boolean;
}
