import { ApiProperty } from '@nestjs/swagger';
import { Transform, Type } from 'class-transformer';
import { Allow, ArrayMaxSize, IsArray, IsBoolean, IsIn, IsInt, IsOptional, IsString, Max, Min } from 'class-validator';
import { DATE_ORDERS, type DateOrder } from '../roster-dates';

/** Multipart fields arrive as text: a mapping as JSON, numbers and booleans as words. */
const fromJsonText = ({ value }: { value: unknown }) => {
  if (typeof value !== 'string') return value;
  try {
    return JSON.parse(value) as unknown;
  } catch {
    return value;
  }
};

export class RosterImportDto {
  @ApiProperty({ required: false, description: 'The roster as text (pasted from a spreadsheet, or a CSV file read as text); or upload it as the multipart field `file`.' })
  @IsOptional()
  @IsString({ message: 'Send the roster as text.' })
  text?: string;

  @ApiProperty({ required: false, description: 'One entry per column (field name or "ignore"), or an object from column number (from 0) to field.' })
  @IsOptional()
  @Allow()
  @Transform(fromJsonText)
  mapping?: unknown;

  @ApiProperty({ required: false, enum: DATE_ORDERS })
  @IsOptional()
  @IsIn(DATE_ORDERS, { message: 'Choose day first (dmy) or month first (mdy).' })
  dateOrder?: DateOrder;

  @ApiProperty({ required: false, description: 'Preview only: the page of rows to return (100 a page).' })
  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'The page must be a whole number.' })
  @Min(1, { message: 'Pages start at 1.' })
  @Max(1000, { message: 'There are at most 100 pages.' })
  page?: number;

  @ApiProperty({ required: false, description: 'Preview only: list only the rows with problems.' })
  @IsOptional()
  @Transform(({ value }) => (value === 'true' ? true : value === 'false' ? false : value))
  @IsBoolean({ message: 'Say true or false.' })
  onlyProblems?: boolean;
}

export class RosterInvitationsDto {
  @ApiProperty({ type: [Number] })
  @IsArray({ message: 'Send the members to invite as a list.' })
  // Each invitation is its own transaction (~40 ms); the page sends them 100 at a time.
  @ArrayMaxSize(500, { message: 'Send at most 500 invitations at a time.' })
  @IsInt({ each: true, message: 'Each member must be a membership number.' })
  membershipIds!: number[];
}
