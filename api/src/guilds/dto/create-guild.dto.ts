import { ApiProperty } from '@nestjs/swagger';
import { IsIn, IsInt, IsNotEmpty, IsString, Max, MaxLength, Min, MinLength, ValidateBy } from 'class-validator';
import { CleanText } from '../../common/validators/text';
import { IANAZone } from 'luxon';

/** ISO 4217 codes the runtime knows (Intl), so amounts can be formatted in them. */
const CURRENCIES = new Set(Intl.supportedValuesOf('currency'));

export class CreateGuildDto {
  @ApiProperty({ example: 'Fernhollow Quilters' })
  @IsString({ message: "Write the guild's name." })
  @MinLength(2, { message: "Write the guild's name (at least 2 letters)." })
  @MaxLength(120, { message: 'Use at most 120 characters.' })
  @CleanText()
  name!: string;

  @ApiProperty({ example: 'Fernhollow' })
  @IsString({ message: 'Write the town the guild meets in.' })
  @IsNotEmpty({ message: 'Write the town the guild meets in.' })
  @MaxLength(120, { message: 'Use at most 120 characters.' })
  @CleanText()
  town!: string;

  @ApiProperty({ example: 'America/Chicago', description: 'IANA time zone' })
  @ValidateBy({
    name: 'isTimeZone',
    validator: { validate: (v: unknown) => typeof v === 'string' && IANAZone.isValidZone(v), defaultMessage: () => 'Choose the time zone from the list, like America/Chicago.' },
  })
  timeZone!: string;

  @ApiProperty({ example: 'USD', description: 'ISO 4217' })
  @ValidateBy({
    name: 'isCurrency',
    validator: { validate: (v: unknown) => typeof v === 'string' && CURRENCIES.has(v), defaultMessage: () => 'Choose the currency from the list, like USD.' },
  })
  currency!: string;

  @ApiProperty({ enum: ['in', 'cm'] })
  @IsIn(['in', 'cm'], { message: 'Choose inches or centimetres.' })
  unit!: 'in' | 'cm';

  @ApiProperty({ minimum: 1, maximum: 12, description: 'The month the membership year starts (1 = January)' })
  @IsInt({ message: 'Choose the month the membership year starts.' })
  @Min(1, { message: 'Choose the month the membership year starts.' })
  @Max(12, { message: 'Choose the month the membership year starts.' })
  yearStartMonth!: number;
}
