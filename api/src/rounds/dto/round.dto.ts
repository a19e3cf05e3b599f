import { ApiProperty } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import {
  IsObject,
  ArrayMaxSize,
  IsArray,
  IsIn,
  IsNotEmpty,
  IsOptional,
  IsString,
  IsUrl,
  Matches,
  MaxLength,
  ValidateIf,
  ValidateNested,
} from 'class-validator';
import { CleanText } from '../../common/validators/text';
import { IsInches } from '../../common/units/inches';
import { BLOCK_STATUSES, type BlockStatus } from '../round-block.entity';

const DATE = /^\d{4}-(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/;

export class SwatchDto {
  @ApiProperty({ example: 'Marigold' })
  @IsString({ message: 'Name the colour.' })
  @IsNotEmpty({ message: 'Name the colour.' })
  @MaxLength(40, { message: 'Use at most 40 characters for a colour name.' })
  @CleanText()
  name!: string;

  @ApiProperty({ example: '#E8A33D' })
  @Matches(/^#[0-9a-fA-F]{6}$/, { message: 'Pick the colour with the colour picker (a value like #E8A33D).' })
  hex!: string;
}

export class RoundInputDto {
  @ApiProperty()
  @IsString({ message: 'Give the block a title.' })
  @IsNotEmpty({ message: 'Give the block a title.' })
  @MaxLength(160, { message: 'Use at most 160 characters.' })
  @CleanText()
  title!: string;

  @ApiProperty({ description: 'Markdown: **bold**, *italic*, lists, links. HTML shows as text.' })
  @IsString({ message: 'Write the instructions as text.' })
  @MaxLength(20000, { message: 'Use at most 20,000 characters.' })
  instructions!: string;

  @ApiProperty({ required: false })
  @IsOptional()
  @ValidateIf((_, v) => v !== '')
  @IsUrl({ protocols: ['http', 'https'], require_protocol: true }, { message: 'Paste a full web address starting with https://.' })
  @MaxLength(500, { message: 'That address is too long.' })
  patternLink?: string;

  @ApiProperty({ example: '12' })
  @IsInches({ max: 120 })
  finishedWidth!: string;

  @ApiProperty({ example: '12' })
  @IsInches({ max: 120 })
  finishedHeight!: string;

  @ApiProperty({ required: false, example: '1/4' })
  @IsOptional()
  @IsInches({ max: 1 })
  seamAllowance?: string;

  @ApiProperty({ required: false, example: '1/8' })
  @IsOptional()
  @IsInches({ max: 1 })
  tolerance?: string;

  @ApiProperty({ enum: ['trim', 'untrimmed'] })
  @IsIn(['trim', 'untrimmed'], { message: 'Choose whether makers trim to size or leave the block untrimmed.' })
  trimMode!: 'trim' | 'untrimmed';

  @ApiProperty({ type: [SwatchDto] })
  @IsArray({ message: 'Send the colours as a list.' })
  @ArrayMaxSize(12, { message: 'Ask for at most 12 colours.' })
  @ValidateNested({ each: true })
  @Type(() => SwatchDto)
  swatches!: SwatchDto[];

  @ApiProperty({ required: false, type: SwatchDto, nullable: true })
  @IsOptional()
  @IsObject({ message: 'Describe the background colour, or leave it out.' })
  @ValidateNested()
  @Type(() => SwatchDto)
  background?: SwatchDto | null;

  @ApiProperty({ enum: ['stash', 'queen_sends'] })
  @IsIn(['stash', 'queen_sends'], { message: "Choose makers' stash or fabric sent by the queen." })
  fabricSource!: 'stash' | 'queen_sends';

  @ApiProperty({ example: '2027-03-15' })
  @Matches(DATE, { message: 'Choose the due date.' })
  dueDate!: string;

  @ApiProperty({ required: false, example: '2027-03-01' })
  @IsOptional()
  @Matches(DATE, { message: 'Choose the date the assignment goes out.' })
  sendDate?: string;

  @ApiProperty({ required: false, example: '08:00' })
  @IsOptional()
  @Matches(/^([01]\d|2[0-3]):[0-5]\d$/, { message: 'Give the time like 08:00.' })
  sendTime?: string;

  @ApiProperty({ enum: ['mail', 'meeting'] })
  @IsIn(['mail', 'meeting'], { message: 'Choose mail or the meeting.' })
  deliveryMethod!: 'mail' | 'meeting';

  @ApiProperty({ required: false })
  @IsOptional()
  @IsString({ message: 'Write the address as text.' })
  @MaxLength(500, { message: 'Use at most 500 characters.' })
  deliveryAddress?: string;

  @ApiProperty({ required: false })
  @IsOptional()
  @IsString({ message: 'Write the meeting details as text.' })
  @MaxLength(500, { message: 'Use at most 500 characters.' })
  meetingDetails?: string;
}

export class UpdateBlockDto {
  @ApiProperty({ enum: BLOCK_STATUSES })
  @IsIn([...BLOCK_STATUSES], { message: 'Choose not started, made, mailed, handed over or received.' })
  status!: BlockStatus;

  @ApiProperty({ required: false })
  @IsOptional()
  @IsString({ message: 'Write the tracking number as text.' })
  @MaxLength(80, { message: 'Use at most 80 characters.' })
  trackingNumber?: string;
}
