import { ApiProperty } from '@nestjs/swagger';
import { ArrayMaxSize, IsArray, IsIn } from 'class-validator';
import { ROLES, type Role } from '../roles';

export class UpdateRolesDto {
  @ApiProperty({ enum: ROLES, isArray: true })
  @IsArray({ message: 'Send the roles as a list.' })
  @ArrayMaxSize(ROLES.length, { message: 'Too many roles.' })
  @IsIn(ROLES, { each: true, message: `Each role must be one of: ${ROLES.join(', ')}.` })
  roles!: Role[];
}
