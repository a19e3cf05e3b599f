import { ApiProperty } from '@nestjs/swagger';
import { IsIn, IsOptional, IsString, MaxLength, ValidateIf } from 'class-validator';
import { IsId } from '../../common/validators/is-id';
import { ROLES, type Role } from '../../guilds/roles';
import { DATE_MESSAGE, IsCalendarDate } from './term-dates';

export const ROLE_MESSAGE = 'Choose the office: admin, treasurer, membership chair or show chair.';
export const NOTE_MESSAGE = 'Keep the note to 300 characters.';

export class CreateTermDto {
  @ApiProperty()
  @IsId('Choose the member.')
  membershipId!: number;

  @ApiProperty({ enum: ROLES })
  @IsIn(ROLES, { message: ROLE_MESSAGE })
  role!: Role;

  @ApiProperty({ example: '2027-01-01', description: "first day in office (guild's local date)" })
  @IsCalendarDate(DATE_MESSAGE)
  startsOn!: string;

  @ApiProperty({ required: false, nullable: true, example: '2028-01-01', description: 'access ends on this day; empty = no end yet' })
  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @IsCalendarDate(DATE_MESSAGE)
  endsOn?: string | null;

  @ApiProperty({ required: false })
  @IsOptional()
  @IsString({ message: 'Write the note as text.' })
  @MaxLength(300, { message: NOTE_MESSAGE })
  note?: string;
}
