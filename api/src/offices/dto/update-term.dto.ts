import { ApiProperty } from '@nestjs/swagger';
import { IsOptional, IsString, MaxLength, ValidateIf } from 'class-validator';
import { NOTE_MESSAGE } from './create-term.dto';
import { DATE_MESSAGE, IsCalendarDate } from './term-dates';

export class UpdateTermDto {
  @ApiProperty({ required: false })
  @IsOptional()
  @IsCalendarDate(DATE_MESSAGE)
  startsOn?: string;

  @ApiProperty({ required: false, nullable: true, description: 'null = no end date' })
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
