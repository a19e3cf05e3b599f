import { ApiProperty } from '@nestjs/swagger';
import { IsNotEmpty, IsOptional, IsString, MaxLength } from 'class-validator';
import { NewPassword } from '../../auth/dto/password-fields';

/** Empty for someone who already has an account (she is signed in); name and password otherwise. */
export class AcceptInvitationDto {
  @ApiProperty({ required: false })
  @IsOptional()
  @IsString({ message: 'Enter your name.' })
  @IsNotEmpty({ message: 'Enter your name.' })
  @MaxLength(120, { message: 'Use at most 120 characters.' })
  name?: string;

  @ApiProperty({ required: false })
  @IsOptional()
  @NewPassword()
  password?: string;
}
