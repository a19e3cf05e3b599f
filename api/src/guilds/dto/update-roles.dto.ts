import { ApiProperty } from '@nestjs/swagger';
import { ArrayMaxSize, IsArray, IsIn, IsOptional, ValidateIf } from 'class-validator';
import { DATE_MESSAGE, IsCalendarDate } from '../../offices/dto/term-dates';
import { ROLES, type Role } from '../roles';

export class UpdateRolesDto {
  @ApiProperty({ enum: ROLES, isArray: true })
  @IsArray({ message: 'Send the roles as a list.' })
  @ArrayMaxSize(ROLES.length, { message: 'Too many roles.' })
  @IsIn(ROLES, { each: true, message: `Each role must be one of: ${ROLES.join(', ')}.` })
  roles!: Role[];

  @ApiProperty({ required: false, nullable: true, example: '2027-01-01', description: 'for roles being added: her access ends on this day (empty = no end date)' })
  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @IsCalendarDate(DATE_MESSAGE)
  endsOn?: string | null;
}
