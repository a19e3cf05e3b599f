import { ApiProperty } from '@nestjs/swagger';
import { IsIn, IsOptional, IsString, MaxLength } from 'class-validator';
import { IsInches } from '../../common/units/inches';

/** The text fields that travel with a photo (multipart form fields arrive as strings). */
export class PhotoFieldsDto {
  @ApiProperty({ required: false, example: '5 15/16', description: "What the maker's ruler reads for the card's long bar" })
  @IsOptional()
  @IsString({ message: 'Type what your ruler reads for the long bar.' })
  @MaxLength(20)
  rulerReading?: string;

  @ApiProperty({ required: false, enum: ['in', 'cm'] })
  @IsOptional()
  @IsIn(['in', 'cm'], { message: 'Say whether you measured the inch bar or the centimetre bar.' })
  rulerUnit?: 'in' | 'cm';
}

export class ManualSizeDto {
  @ApiProperty({ example: '12 1/2' })
  @IsInches({ max: 120 })
  width!: string;

  @ApiProperty({ example: '12 1/2' })
  @IsInches({ max: 120 })
  height!: string;
}
