import { ApiProperty } from '@nestjs/swagger';
import { ArrayMaxSize, IsArray, IsBoolean, IsInt, IsOptional, Max, Min } from 'class-validator';
import { IsInches } from '../../common/units/inches';

export class LayoutPlanDto {
  @ApiProperty({ example: 30 })
  @IsInt({ message: 'Enter how many blocks you have, as a whole number.' })
  @Min(1, { message: 'You need at least 1 block.' })
  @Max(2000, { message: 'Plan at most 2000 blocks at a time.' })
  blockCount!: number;

  @ApiProperty({ example: '12', description: 'finished block width' })
  @IsInches({ max: 120 })
  blockWidth!: string;

  @ApiProperty({ example: '12', description: 'finished block height' })
  @IsInches({ max: 120 })
  blockHeight!: string;

  @ApiProperty({ required: false, example: '2' })
  @IsOptional()
  @IsInches({ max: 24, allowZero: true })
  sashing?: string;

  @IsOptional()
  @IsBoolean({ message: 'Say yes or no.' })
  sashingAround?: boolean;

  @IsOptional()
  @IsBoolean({ message: 'Say yes or no.' })
  cornerstones?: boolean;

  @ApiProperty({ required: false, type: [String], example: ['3', '5'] })
  @IsOptional()
  @IsArray({ message: 'Send the borders as a list.' })
  @ArrayMaxSize(6, { message: 'Plan at most 6 borders.' })
  @IsInches({ max: 48 }, { each: true })
  borders?: string[];

  @IsOptional()
  @IsInches({ max: 6 })
  bindingWidth?: string;

  @IsOptional()
  @IsInches({ min: 10, max: 120 })
  fabricWidth?: string;

  @IsOptional()
  @IsInches({ max: 24, allowZero: true })
  backingMargin?: string;

  @IsOptional()
  @IsInches({ max: 24, allowZero: true })
  battingMargin?: string;

  @IsOptional()
  @IsInt({ message: 'Rows are a whole number.' })
  @Min(1)
  @Max(200)
  rows?: number;

  @IsOptional()
  @IsInt({ message: 'Columns are a whole number.' })
  @Min(1)
  @Max(200)
  columns?: number;
}
