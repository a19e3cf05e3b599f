import { ApiProperty } from '@nestjs/swagger';
import { ArrayMaxSize, IsArray, IsEmail, IsIn, IsOptional, MaxLength } from 'class-validator';
import { ROLES, type Role } from '../../guilds/roles';

export class CreateInvitationDto {
  @ApiProperty({ example: 'new.member@example.org' })
  @IsEmail({}, { message: 'Enter an e-mail address, like name@example.org.' })
  @MaxLength(254, { message: 'That e-mail address is too long.' })
  email!: string;

  @ApiProperty({ enum: ROLES, isArray: true, required: false })
  @IsOptional()
  @IsArray({ message: 'Send the roles as a list.' })
  @ArrayMaxSize(ROLES.length, { message: 'Too many roles.' })
  @IsIn(ROLES, { each: true, message: `Each role must be one of: ${ROLES.join(', ')}.` })
  roles?: Role[];
}
