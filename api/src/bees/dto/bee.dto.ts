import { ApiProperty } from '@nestjs/swagger';
import {
  ArrayMaxSize,
  ArrayMinSize,
  IsArray,
  IsBoolean,
  IsIn,
  IsInt,
  IsNotEmpty,
  IsOptional,
  IsString,
  Matches,
  Max,
  MaxLength,
  Min,
} from 'class-validator';
import { CleanText, OmitOrGive } from '../../common/validators/text';

const MONTH = /^\d{4}-(0[1-9]|1[0-2])$/;
const monthMessage = 'Choose a month, like 2027-03.';

export class CreateBeeDto {
  @ApiProperty()
  @CleanText()
  @IsString({ message: 'Give the bee a name.' })
  @IsNotEmpty({ message: 'Give the bee a name.' })
  @MaxLength(120, { message: 'Use at most 120 characters.' })
  name!: string;

  @ApiProperty({ required: false })
  @OmitOrGive()
  @CleanText()
  @IsString({ message: 'Write the description as text.' })
  @MaxLength(2000, { message: 'Use at most 2000 characters.' })
  description?: string;

  @ApiProperty({ enum: ['mail', 'meeting'] })
  @IsIn(['mail', 'meeting'], { message: 'Choose whether blocks go by mail or at meetings.' })
  handover!: 'mail' | 'meeting';

  @ApiProperty({ example: '2027-01' })
  @Matches(MONTH, { message: monthMessage })
  startMonth!: string;

  @ApiProperty({ minimum: 1, maximum: 24 })
  @IsInt({ message: 'Enter a whole number of months.' })
  @Min(1, { message: 'A bee runs for at least 1 month.' })
  @Max(24, { message: 'A bee runs for at most 24 months.' })
  months!: number;
}

export class UpdateBeeDto {
  @OmitOrGive()
  @CleanText()
  @IsString({ message: 'Give the bee a name.' })
  @IsNotEmpty({ message: 'Give the bee a name.' })
  @MaxLength(120, { message: 'Use at most 120 characters.' })
  name?: string;

  @OmitOrGive()
  @CleanText()
  @IsString({ message: 'Write the description as text.' })
  @MaxLength(2000, { message: 'Use at most 2000 characters.' })
  description?: string;

  @OmitOrGive()
  @IsIn(['mail', 'meeting'], { message: 'Choose whether blocks go by mail or at meetings.' })
  handover?: 'mail' | 'meeting';
}

export class InviteToBeeDto {
  @ApiProperty({ type: [Number] })
  @IsArray({ message: 'Choose at least one member.' })
  @ArrayMinSize(1, { message: 'Choose at least one member.' })
  @ArrayMaxSize(100, { message: 'Invite at most 100 members at a time.' })
  @IsInt({ each: true, message: 'Choose members from the list.' })
  membershipIds!: number[];
}

export class RotationDto {
  @ApiProperty({ enum: ['shuffle', 'manual'] })
  @IsIn(['shuffle', 'manual'], { message: 'Choose to shuffle or to set the order by hand.' })
  mode!: 'shuffle' | 'manual';

  @ApiProperty({ required: false })
  @IsOptional()
  @IsString({ message: 'The seed is a short word.' })
  @Matches(/^[A-Za-z0-9-]{1,32}$/, { message: 'The seed is up to 32 letters, digits or dashes.' })
  seed?: string;

  @ApiProperty({ required: false, type: [Number] })
  @IsOptional()
  @IsArray({ message: 'Give the order as a list of members.' })
  @ArrayMaxSize(100)
  @IsInt({ each: true, message: 'Choose members from the list.' })
  order?: number[];
}

export class SkipMonthDto {
  @Matches(MONTH, { message: monthMessage })
  month!: string;

  @IsBoolean({ message: 'Say whether to skip the month.' })
  skipped!: boolean;
}

export class SwapMonthsDto {
  @Matches(MONTH, { message: monthMessage })
  monthA!: string;

  @Matches(MONTH, { message: monthMessage })
  monthB!: string;
}

export const MONTH_PATTERN = MONTH;
