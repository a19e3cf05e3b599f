import { ApiProperty, PartialType, PickType } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { IsBoolean, IsEmail, IsIn, IsOptional, IsString, Matches, MaxLength, ValidateBy, ValidateIf } from 'class-validator';

const trimmed = () => Transform(({ value }) => (typeof value === 'string' ? value.trim() : value));
/** An empty text box means "none". */
const blankIsNull = () => Transform(({ value }) => (typeof value === 'string' && value.trim() === '' ? null : typeof value === 'string' ? value.trim() : value));
const present = (_: unknown, v: unknown) => v !== null && v !== undefined;

/** Her name: 1–120 characters, with one message for each way it can be wrong. */
const NameField = () =>
  ValidateBy({
    name: 'memberName',
    validator: {
      validate: (v: unknown) => typeof v === 'string' && v.trim() !== '' && v.length <= 120,
      defaultMessage: (args) => (typeof args?.value === 'string' && args.value.length > 120 ? 'Use at most 120 characters.' : 'Enter her name.'),
    },
  });

export const PHONE_PATTERN = /^\+?[0-9 ()./-]{5,40}$/;
const PHONE_MESSAGE = 'Write a phone number with digits, spaces and + ( ) - only, like +1 555 0142.';
const EMAIL_MESSAGE = 'Enter an e-mail address, like name@example.org, or leave it empty.';

/** A member the officers keep on her behalf: she may have no e-mail address and never signs in. */
export class CreatePaperMemberDto {
  @ApiProperty({ example: 'Mabel Thornbury' })
  @trimmed()
  @NameField()
  name!: string;

  @ApiProperty({ required: false, nullable: true, description: 'Leave out for a member kept on paper.' })
  @blankIsNull()
  @IsOptional()
  @ValidateIf(present)
  @IsEmail({}, { message: EMAIL_MESSAGE })
  @MaxLength(254, { message: 'That e-mail address is too long.' })
  email?: string | null;

  @ApiProperty({ required: false, nullable: true, example: '+1 555 0142' })
  @blankIsNull()
  @IsOptional()
  @ValidateIf(present)
  @IsString({ message: 'Write the phone number as text.' })
  @Matches(PHONE_PATTERN, { message: PHONE_MESSAGE })
  phone?: string | null;

  @ApiProperty({ required: false, nullable: true })
  @blankIsNull()
  @IsOptional()
  @ValidateIf(present)
  @IsString({ message: 'Write the town as text.' })
  @MaxLength(120, { message: 'Use at most 120 characters.' })
  town?: string | null;

  @ApiProperty({ required: false, example: '2019-09-01', description: 'When she joined the guild; today if left out.' })
  @blankIsNull()
  @IsOptional()
  @ValidateIf(present)
  @IsString({ message: 'Write the date like 2019-09-01.' })
  @Matches(/^\d{4}-\d{2}-\d{2}$/, { message: 'Write the date like 2019-09-01.' })
  memberSince?: string | null;

  @ApiProperty({ required: false })
  @ValidateIf((_, v) => v !== undefined)
  @IsBoolean({ message: 'Say whether members may see her phone number.' })
  showPhone?: boolean;

  @ApiProperty({ required: false })
  @ValidateIf((_, v) => v !== undefined)
  @IsBoolean({ message: 'Say whether members may see her town.' })
  showTown?: boolean;
}

/** Changes to the details of a member who does not sign in; fields left out stay as they are. */
export class UpdateMemberDetailsDto extends PartialType(PickType(CreatePaperMemberDto, ['name', 'email', 'phone', 'town', 'showPhone', 'showTown'] as const), {
  skipNullProperties: false,
}) {
  @ApiProperty({ required: false })
  @ValidateIf((_, v) => v !== undefined)
  @IsBoolean({ message: 'Say whether members may see her e-mail address.' })
  showEmail?: boolean;
}

export class RosterPdfQueryDto {
  @ApiProperty({ required: false, enum: ['a4', 'letter'] })
  @IsOptional()
  @IsIn(['a4', 'letter'], { message: 'Choose a4 or letter paper.' })
  paper?: 'a4' | 'letter';
}
