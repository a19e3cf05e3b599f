import { ApiProperty } from '@nestjs/swagger';
import { IsBoolean, IsEmail, IsNotEmpty, IsOptional, IsString, MaxLength } from 'class-validator';

export class SignInDto {
  @ApiProperty({ example: 'hazel@wrenfield.example' })
  @IsEmail({}, { message: 'Enter your e-mail address, like name@example.org.' })
  @MaxLength(254, { message: 'That e-mail address is too long.' })
  email!: string;

  @ApiProperty()
  @IsString({ message: 'Enter your password.' })
  @IsNotEmpty({ message: 'Enter your password.' })
  @MaxLength(200, { message: 'That password is too long.' })
  password!: string;

  @ApiProperty({ required: false, description: 'Keep me signed in on this device (30 days).' })
  @IsOptional()
  @IsBoolean({ message: 'Choose yes or no.' })
  remember?: boolean;
}
