import { ApiProperty, PartialType } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import {
  ArrayMaxSize,
  ArrayMinSize,
  IsArray,
  IsBoolean,
  IsIn,
  IsInt,
  IsISO8601,
  IsNotEmpty,
  IsObject,
  IsOptional,
  IsString,
  Matches,
  Max,
  MaxLength,
  Min,
  ValidateIf,
  ValidateNested,
} from 'class-validator';
import { IsInches } from '../../common/units/inches';
import { IsId } from '../../common/validators/is-id';
import { CleanText, OmitOrGive } from '../../common/validators/text';
import { SIZE_RULE_KINDS, type SizeRuleKind } from '../show-category.entity';
import { RANKED_METHODS, type RankedMethod, VOTING_KINDS, type VotingKind } from '../show.entity';

const DATE = /^\d{4}-(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/;
const dateMessage = 'Write the date as yyyy-mm-dd, like 2027-05-14.';
const MAX_FEE_CENTS = 100_000;

const optionalNumber = (min: number, max: number, message: string): PropertyDecorator => (target, key) => {
  IsOptional()(target, key);
  ValidateIf((_, v) => v !== null)(target, key);
  IsInt({ message })(target, key);
  Min(min, { message })(target, key);
  Max(max, { message })(target, key);
};
/** Optional inch text, where null or "" clears the setting. */
const optionalInches = (max: number): PropertyDecorator => (target, key) => {
  IsOptional()(target, key);
  ValidateIf((_, v) => v !== null && v !== '')(target, key);
  IsInches({ max })(target, key);
};

export class CreateShowDto {
  @ApiProperty({ example: 'Wrenfield Spring Quilt Show' })
  @CleanText()
  @IsString({ message: 'Give the show a name.' })
  @IsNotEmpty({ message: 'Give the show a name.' })
  @MaxLength(120, { message: 'Use at most 120 characters.' })
  name!: string;

  @ApiProperty({ example: 'Grange Hall, 4 Mill Lane' })
  @CleanText()
  @IsString({ message: 'Say where the show is.' })
  @IsNotEmpty({ message: 'Say where the show is.' })
  @MaxLength(200, { message: 'Use at most 200 characters.' })
  venue!: string;

  @ApiProperty({ required: false })
  @OmitOrGive()
  @CleanText()
  @IsString({ message: 'Write the description as text.' })
  @MaxLength(4000, { message: 'Use at most 4,000 characters.' })
  description?: string;

  @ApiProperty({ example: '2027-05-14' })
  @Matches(DATE, { message: dateMessage })
  startsOn!: string;

  @ApiProperty({ example: '2027-05-15' })
  @Matches(DATE, { message: dateMessage })
  endsOn!: string;

  @ApiProperty({ required: false, nullable: true })
  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @Matches(DATE, { message: dateMessage })
  entriesOpenOn?: string | null;

  @ApiProperty({ required: false, nullable: true })
  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @Matches(DATE, { message: dateMessage })
  entriesCloseOn?: string | null;

  @ApiProperty({ required: false, nullable: true })
  @optionalNumber(1, 50, 'Enter a whole number of quilts from 1 to 50, or leave it empty for no limit.')
  maxEntriesPerMember?: number | null;

  @ApiProperty({ required: false, description: 'Per quilt, in cents; 0 for no fee' })
  @OmitOrGive()
  @IsInt({ message: 'Enter the entry fee as a whole number of cents (500 for 5.00).' })
  @Min(0, { message: 'The entry fee cannot be negative.' })
  @Max(MAX_FEE_CENTS, { message: 'The entry fee must be at most 1,000.00.' })
  entryFeeCents?: number;

  @ApiProperty({ required: false, nullable: true, description: 'Most one member pays, in cents' })
  @optionalNumber(1, MAX_FEE_CENTS, 'Enter the cap as a whole number of cents above 0, or leave it empty for no cap.')
  entryFeeCapCents?: number | null;

  @ApiProperty({ required: false, example: '4' })
  @OmitOrGive()
  @IsInches({ min: 1, max: 12 })
  sleeveDepthIn?: string;

  @ApiProperty({ required: false, nullable: true, example: '30' })
  @optionalInches(200)
  narrowUnderIn?: string | null;

  @ApiProperty({ required: false, nullable: true, example: '3' })
  @optionalInches(12)
  narrowDepthIn?: string | null;

  @ApiProperty({ required: false, nullable: true, example: '90' })
  @optionalInches(400)
  splitOverIn?: string | null;

  @ApiProperty({ required: false, enum: VOTING_KINDS })
  @OmitOrGive()
  @IsIn(VOTING_KINDS, { message: 'Choose one vote per category, approval, or ranked.' })
  votingKind?: VotingKind;

  @ApiProperty({ required: false, enum: RANKED_METHODS })
  @OmitOrGive()
  @IsIn(RANKED_METHODS, { message: 'Choose 3/2/1 points or instant runoff.' })
  rankedMethod?: RankedMethod;

  @ApiProperty({ required: false, minimum: 2, maximum: 5 })
  @OmitOrGive()
  @IsInt({ message: 'A ranked ballot lists 2 to 5 places.' })
  @Min(2, { message: 'A ranked ballot lists 2 to 5 places.' })
  @Max(5, { message: 'A ranked ballot lists 2 to 5 places.' })
  rankDepth?: number;
}

export class UpdateShowDto extends PartialType(CreateShowDto, { skipNullProperties: false }) {
  @ApiProperty({ required: false, nullable: true, description: 'ISO instant' })
  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @IsISO8601({ strict: true }, { message: 'Choose a date and time for voting to open.' })
  votingOpensAt?: string | null;

  @ApiProperty({ required: false, nullable: true, description: 'ISO instant' })
  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @IsISO8601({ strict: true }, { message: 'Choose a date and time for voting to close.' })
  votingClosesAt?: string | null;

  @ApiProperty({ required: false })
  @OmitOrGive()
  @IsBoolean({ message: "Say whether makers' names stay hidden." })
  makersHidden?: boolean;
}

export class SizeRuleDto {
  @ApiProperty({ enum: SIZE_RULE_KINDS })
  @IsIn(SIZE_RULE_KINDS, { message: 'Choose no size rule, width and height limits, or a perimeter band.' })
  kind!: SizeRuleKind;

  @ApiProperty({ required: false, nullable: true }) @optionalInches(600) minWidthIn?: string | null;
  @ApiProperty({ required: false, nullable: true }) @optionalInches(600) maxWidthIn?: string | null;
  @ApiProperty({ required: false, nullable: true }) @optionalInches(600) minHeightIn?: string | null;
  @ApiProperty({ required: false, nullable: true }) @optionalInches(600) maxHeightIn?: string | null;
  @ApiProperty({ required: false, nullable: true }) @optionalInches(2400) minIn?: string | null;
  @ApiProperty({ required: false, nullable: true }) @optionalInches(2400) maxIn?: string | null;

  @ApiProperty({ required: false })
  @OmitOrGive()
  @IsBoolean({ message: 'Say whether the lower limit itself is allowed.' })
  minInclusive?: boolean;

  @ApiProperty({ required: false })
  @OmitOrGive()
  @IsBoolean({ message: 'Say whether the upper limit itself is allowed.' })
  maxInclusive?: boolean;
}

export class CategoryDto {
  @ApiProperty({ example: 'Bed quilts, pieced' })
  @CleanText()
  @IsString({ message: 'Name the category.' })
  @IsNotEmpty({ message: 'Name the category.' })
  @MaxLength(80, { message: 'Use at most 80 characters.' })
  name!: string;

  @ApiProperty({ required: false })
  @OmitOrGive()
  @CleanText()
  @IsString({ message: 'Write the description as text.' })
  @MaxLength(500, { message: 'Use at most 500 characters.' })
  description?: string;

  @ApiProperty({ required: false, description: 'false: exhibit only' })
  @OmitOrGive()
  @IsBoolean({ message: 'Say whether the category is judged or exhibit only.' })
  judged?: boolean;

  @ApiProperty({ required: false, type: SizeRuleDto })
  @OmitOrGive()
  @IsObject({ message: 'Describe the size rule.' })
  @ValidateNested()
  @Type(() => SizeRuleDto)
  sizeRule?: SizeRuleDto;

  @ApiProperty({ required: false, nullable: true })
  @optionalNumber(2, 50, 'Enter the least number of makers (2 to 50), or leave it empty.')
  minMakers?: number | null;

  @ApiProperty({ required: false, nullable: true })
  @optionalNumber(1, 50, 'Enter a whole number of quilts from 1 to 50, or leave it empty for no limit.')
  maxEntriesPerMember?: number | null;

  @ApiProperty({ required: false })
  @OmitOrGive()
  @IsInt({ message: 'The order is a whole number.' })
  @Min(0, { message: 'The order is a whole number from 0.' })
  @Max(999, { message: 'The order is a whole number up to 999.' })
  sortOrder?: number;
}

export class UpdateCategoryDto extends PartialType(CategoryDto, { skipNullProperties: false }) {}

export class EntryDto {
  @ApiProperty()
  @IsId('Choose a category.')
  categoryId!: number;

  @ApiProperty({ example: 'Evening on the Millpond' })
  @CleanText()
  @IsString({ message: 'Give the quilt a title.' })
  @IsNotEmpty({ message: 'Give the quilt a title.' })
  @MaxLength(160, { message: 'Use at most 160 characters.' })
  title!: string;

  @ApiProperty({ example: '60 1/2' })
  @IsInches({ min: 4, max: 200 })
  widthIn!: string;

  @ApiProperty({ example: '72' })
  @IsInches({ min: 4, max: 200 })
  heightIn!: string;

  @ApiProperty({ type: [String] })
  @CleanText()
  @IsArray({ message: 'List who made the quilt.' })
  @ArrayMinSize(1, { message: 'Name at least one maker.' })
  @ArrayMaxSize(30, { message: 'List at most 30 makers.' })
  @IsString({ each: true, message: "Write each maker's name as text." })
  @IsNotEmpty({ each: true, message: "A maker's name cannot be empty." })
  @MaxLength(120, { each: true, message: "Use at most 120 characters for each maker's name." })
  makers!: string[];

  @ApiProperty({ required: false, description: 'Who quilted it (the makers, or a longarm quilter)' })
  @OmitOrGive()
  @CleanText()
  @IsString({ message: 'Write who quilted it as text.' })
  @MaxLength(120, { message: 'Use at most 120 characters.' })
  quilter?: string;

  @ApiProperty({ required: false })
  @OmitOrGive()
  @CleanText()
  @IsString({ message: 'Write the techniques as text.' })
  @MaxLength(300, { message: 'Use at most 300 characters.' })
  techniques?: string;

  @ApiProperty({ required: false })
  @OmitOrGive()
  @CleanText()
  @IsString({ message: 'Write the story as text.' })
  @MaxLength(1000, { message: 'Keep the story to 1,000 characters.' })
  story?: string;

  @ApiProperty({ required: false })
  @OmitOrGive()
  @IsBoolean({ message: 'Say whether the quilt is for sale.' })
  forSale?: boolean;

  @ApiProperty({ required: false, nullable: true })
  @optionalNumber(1, 10_000_000, 'Enter the price as a whole number of cents above 0, or leave it empty.')
  priceCents?: number | null;

  @ApiProperty({ required: false, description: "Show chair only: the member this quilt is entered for" })
  @OmitOrGive()
  @IsId('Choose the member you are entering this quilt for.')
  onBehalfOf?: number;
}

export class UpdateEntryDto extends PartialType(EntryDto, { skipNullProperties: false }) {
  @ApiProperty({ required: false, nullable: true, description: 'Show chair only' })
  @optionalNumber(1, 9999, 'Entry numbers are whole numbers from 1 to 9999.')
  entryNumber?: number | null;
}

export class ReviewEntryDto {
  @ApiProperty({ enum: ['accept', 'decline'] })
  @IsIn(['accept', 'decline'], { message: 'Accept or decline the entry.' })
  decision!: 'accept' | 'decline';

  @ApiProperty({ required: false })
  @OmitOrGive()
  @CleanText()
  @IsString({ message: 'Write the reason as text.' })
  @MaxLength(500, { message: 'Use at most 500 characters.' })
  reason?: string;
}

export class NumberEntriesDto {
  @ApiProperty({ required: false, default: 1 })
  @OmitOrGive()
  @IsInt({ message: 'Start numbering at a whole number from 1.' })
  @Min(1, { message: 'Start numbering at a whole number from 1.' })
  @Max(9000, { message: 'Start numbering at 9000 or below.' })
  startAt?: number;
}

export class IssueCodesDto {
  @ApiProperty({ minimum: 1, maximum: 2000 })
  @IsInt({ message: 'Print a whole number of cards, 1 to 2,000.' })
  @Min(1, { message: 'Print a whole number of cards, 1 to 2,000.' })
  @Max(2000, { message: 'Print at most 2,000 cards at a time.' })
  count!: number;
}

export class BallotDto {
  @ApiProperty({ description: '{ categories: { "<categoryId>": [entryId, …] } } or { ranked: [entryId, …] }' })
  @IsObject({ message: 'Choose the quilts you vote for.' })
  choices!: Record<string, unknown>;
}

export class PaperBallotDto extends BallotDto {
  @ApiProperty({ example: 'K7QM-3XHD-9PRW' })
  @IsString({ message: 'Type the code printed on the paper ballot.' })
  @IsNotEmpty({ message: 'Type the code printed on the paper ballot.' })
  @MaxLength(64, { message: 'That is too long to be a ballot code.' })
  code!: string;
}

export class TieDecisionDto {
  @ApiProperty({ nullable: true, description: 'null for the overall (ranked) award' })
  @ValidateIf((_, v) => v !== null)
  @IsId('Choose the category of the tie.')
  categoryId!: number | null;

  @ApiProperty({ type: [Number], description: 'The tied entries, best first' })
  @IsArray({ message: 'Put the tied entries in order.' })
  @ArrayMinSize(2, { message: 'A tie has at least two entries.' })
  @ArrayMaxSize(50, { message: 'That is too many entries for one tie.' })
  @IsInt({ each: true, message: 'Entries are given by their ids.' })
  order!: number[];

  @ApiProperty({ required: false })
  @OmitOrGive()
  @CleanText()
  @IsString({ message: 'Write the note as text.' })
  @MaxLength(300, { message: 'Use at most 300 characters.' })
  note?: string;
}
