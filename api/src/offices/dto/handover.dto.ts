import { ApiProperty } from '@nestjs/swagger';
import { IsIn, IsOptional, IsString, MaxLength } from 'class-validator';
import { IsId } from '../../common/validators/is-id';
import { ROLES, type Role } from '../../guilds/roles';
import { NOTE_MESSAGE, ROLE_MESSAGE } from './create-term.dto';
import { DATE_MESSAGE, IsCalendarDate } from './term-dates';

export class HandoverDto {
  @ApiProperty({ enum: ROLES })
  @IsIn(ROLES, { message: ROLE_MESSAGE })
  role!: Role;

  @ApiProperty()
  @IsId('Choose who hands the office over.')
  fromMembershipId!: number;

  @ApiProperty()
  @IsId('Choose who takes the office on.')
  toMembershipId!: number;

  @ApiProperty({ example: '2027-01-01', description: 'the outgoing access ends and the incoming begins on this day' })
  @IsCalendarDate(DATE_MESSAGE)
  on!: string;

  @ApiProperty({ required: false })
  @IsOptional()
  @IsString({ message: 'Write the note as text.' })
  @MaxLength(300, { message: NOTE_MESSAGE })
  note?: string;
}
