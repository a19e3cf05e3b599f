import { ApiProperty } from '@nestjs/swagger';
import { IsBoolean, IsOptional } from 'class-validator';

export class LeaveGuildDto {
  @ApiProperty({ required: false, description: 'ask the admins to erase her personal data once she has gone' })
  @IsOptional()
  @IsBoolean({ message: 'Say yes or no to erasing your details.' })
  eraseRequest?: boolean;
}
