import { ApiProperty } from '@nestjs/swagger';
import { Equals } from 'class-validator';

export class EraseMemberDto {
  @ApiProperty({ description: 'must be true: the admin has read what will be erased and what is kept' })
  @Equals(true, { message: 'Tick the box to confirm that you understand this cannot be undone.' })
  confirm!: boolean;
}
