import { ApiProperty, PartialType } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import {
  ArrayMaxSize,
  IsArray,
  IsBoolean,
  IsIn,
  IsInt,
  IsNotEmpty,
  IsOptional,
  IsString,
  Matches,
  Max,
  MaxLength,
  Min,
  ValidateIf,
  ValidateNested,
} from 'class-validator';
import { CleanText } from '../../common/validators/text';
import { IsId } from '../../common/validators/is-id';
import { INVOICE_STATUSES, PAYMENT_METHODS, type InvoiceStatus, type PaymentMethod } from '../dues-invoice.entity';
import { PLAN_KINDS } from '../dues-plan.entity';
import type { PlanKind } from '../dues-rules';

const DATE = /^\d{4}-(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/;
const dateMessage = 'Write the date as yyyy-mm-dd, like 2027-01-15.';
/** The largest amount we take in one go: 100,000.00 in a two-decimal currency. */
export const MAX_AMOUNT_CENTS = 10_000_000;
const month = (what: string) => [
  IsInt({ message: `Choose ${what} (1 to 12).` }),
  Min(1, { message: `Choose ${what} (1 to 12).` }),
  Max(12, { message: `Choose ${what} (1 to 12).` }),
];
const apply = (decorators: PropertyDecorator[]): PropertyDecorator => (target, key) => decorators.forEach((d) => d(target, key));
const cents = (what: string, min: number) => [
  IsInt({ message: `Enter ${what} as a whole number of cents (2500 for 25.00).` }),
  Min(min, { message: min > 0 ? `${what[0].toUpperCase()}${what.slice(1)} must be more than 0.` : `${what[0].toUpperCase()}${what.slice(1)} cannot be negative.` }),
  Max(MAX_AMOUNT_CENTS, { message: `${what[0].toUpperCase()}${what.slice(1)} must be at most ${MAX_AMOUNT_CENTS} cents.` }),
];


export class ProrationBandDto {
  @ApiProperty({ minimum: 1, maximum: 12 })
  @apply(month('the first month of the band'))
  fromMonth!: number;

  @ApiProperty({ enum: ['full', 'half'] })
  @IsIn(['full', 'half'], { message: 'Choose full or half dues for joiners in these months.' })
  charge!: 'full' | 'half';

  @ApiProperty()
  @IsBoolean({ message: 'Say whether joining in these months also pays for the next year.' })
  coversNextYear!: boolean;
}

export class DuesSettingsDto {
  @ApiProperty({ required: false, example: 'USD', description: "ISO 4217; changes the guild's currency (only before any invoice exists)" })
  @IsOptional()
  @IsString({ message: 'Choose a currency such as USD.' })
  @Matches(/^[A-Za-z]{3}$/, { message: 'Use a three-letter currency code such as USD.' })
  currency?: string;

  @ApiProperty({ minimum: 1, maximum: 12 })
  @apply(month('the month the membership year starts'))
  yearStartMonth!: number;

  @ApiProperty({ minimum: 1, maximum: 12 })
  @apply(month('the month dues are due'))
  dueMonth!: number;

  @ApiProperty({ minimum: 1, maximum: 31 })
  @IsInt({ message: 'Choose the day dues are due.' })
  @Min(1, { message: 'Choose the day dues are due.' })
  @Max(31, { message: 'Choose the day dues are due.' })
  dueDay!: number;

  @ApiProperty({ minimum: 0, maximum: 364 })
  @IsInt({ message: 'Enter the grace period as a whole number of days.' })
  @Min(0, { message: 'The grace period cannot be negative.' })
  @Max(364, { message: 'The grace period must be under a year (at most 364 days).' })
  graceDays!: number;

  @ApiProperty({ minimum: 0, description: 'minor units (cents)' })
  @apply(cents('the late fee', 0))
  lateFeeCents!: number;

  @ApiProperty({ required: false, minimum: 0, maximum: 180 })
  @IsOptional()
  @IsInt({ message: 'Enter a whole number of days.' })
  @Min(0, { message: 'Early renewal cannot open after the due date.' })
  @Max(180, { message: 'Early renewal opens at most 180 days ahead.' })
  earlyRenewalDays?: number;

  @ApiProperty({ type: [ProrationBandDto] })
  @IsArray({ message: 'List the joiner bands (the list may be empty).' })
  @ArrayMaxSize(12, { message: 'Use at most 12 bands, one per month.' })
  @ValidateNested({ each: true, message: 'Each band needs fromMonth, charge and coversNextYear.' })
  @Type(() => ProrationBandDto)
  proration!: ProrationBandDto[];
}

export class CreatePlanDto {
  @ApiProperty({ example: 'Regular' })
  @IsString({ message: 'Give the plan a name.' })
  @IsNotEmpty({ message: 'Give the plan a name.' })
  @MaxLength(80, { message: 'Use at most 80 characters.' })
  @CleanText()
  name!: string;

  @ApiProperty({ enum: PLAN_KINDS })
  @IsIn([...PLAN_KINDS], { message: 'Choose standard, household, lifetime or honorary.' })
  kind!: PlanKind;

  @ApiProperty({ description: 'minor units (cents); 0 for lifetime and honorary' })
  @apply(cents('the yearly dues', 0))
  yearlyCents!: number;

  @ApiProperty({ required: false, nullable: true })
  @IsOptional()
  @IsInt({ message: 'Enter an age in whole years.' })
  @Min(0, { message: 'Enter an age in whole years.' })
  @Max(150, { message: 'Enter an age in whole years.' })
  minAge?: number | null;

  @ApiProperty({ required: false, nullable: true })
  @IsOptional()
  @IsInt({ message: 'Enter an age in whole years.' })
  @Min(0, { message: 'Enter an age in whole years.' })
  @Max(150, { message: 'Enter an age in whole years.' })
  maxAge?: number | null;

  @ApiProperty({ required: false, default: true })
  @IsOptional()
  @IsBoolean({ message: 'Say whether members can choose this plan.' })
  active?: boolean;
}

/** Any of the plan's fields; each is checked as when the plan was made. */
export class UpdatePlanDto extends PartialType(CreatePlanDto) {}

export class CheckoutDto {
  @ApiProperty()
  @IsId('Choose a membership plan.')
  planId!: number;
}

export class ManualPaymentDto {
  @ApiProperty()
  @IsId('Choose the member who paid.')
  membershipId!: number;

  @ApiProperty()
  @IsId('Choose the plan she paid for.')
  planId!: number;

  @ApiProperty({ enum: ['cash', 'cheque'] })
  @IsIn(['cash', 'cheque'], { message: 'Choose cash or cheque.' })
  method!: 'cash' | 'cheque';

  @ApiProperty({ required: false, description: 'required for cheques' })
  @ValidateIf((o: ManualPaymentDto) => o.method === 'cheque' || o.chequeNumber !== undefined)
  @IsString({ message: 'Enter the cheque number.' })
  @Matches(/\S/, { message: 'Enter the cheque number.' })
  @MaxLength(40, { message: 'Use at most 40 characters.' })
  chequeNumber?: string;

  @ApiProperty({ description: 'minor units (cents), more than 0' })
  @apply(cents('the amount', 1))
  amountCents!: number;

  @ApiProperty({ example: '2026-12-01' })
  @IsString({ message: dateMessage })
  @Matches(DATE, { message: dateMessage })
  receivedOn!: string;
}

export class RefundDto {
  @ApiProperty({ description: 'minor units (cents), more than 0 and at most what is left' })
  @apply(cents('the refund', 1))
  amountCents!: number;

  @ApiProperty({ required: false })
  @IsOptional()
  @IsString({ message: 'Write the reason as text.' })
  @MaxLength(500, { message: 'Use at most 500 characters.' })
  reason?: string;
}

export class CreateHouseholdDto {
  @ApiProperty({ example: 'Garroway household' })
  @IsString({ message: 'Name the household.' })
  @IsNotEmpty({ message: 'Name the household.' })
  @MaxLength(120, { message: 'Use at most 120 characters.' })
  @CleanText()
  name!: string;
}

export class UpdateDuesMemberDto {
  @ApiProperty({ required: false, nullable: true })
  @IsOptional()
  @IsInt({ message: 'Choose a plan from the list.' })
  planId?: number | null;

  @ApiProperty({ required: false, nullable: true })
  @IsOptional()
  @IsInt({ message: 'Choose a household from the list.' })
  householdId?: number | null;

  @ApiProperty({ required: false, nullable: true, example: '2011-04-12' })
  @IsOptional()
  @IsString({ message: dateMessage })
  @Matches(DATE, { message: dateMessage })
  birthDate?: string | null;
}

export class ListQueryDto {
  @ApiProperty({ required: false, default: 100 })
  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'Use a whole number.' })
  @Min(1, { message: 'Ask for at least 1.' })
  @Max(500, { message: 'Ask for at most 500.' })
  limit?: number;
}

const STATUS_LIST = /^(current|grace|lapsed|lifetime|honorary)(,(current|grace|lapsed|lifetime|honorary))*$/;

export class RosterQueryDto {
  @ApiProperty({ required: false, example: 'grace,lapsed', description: 'comma-separated statuses; empty for everyone' })
  @IsOptional()
  @ValidateIf((_, v) => v !== '')
  @Matches(STATUS_LIST, { message: 'Choose statuses from current, grace, lapsed, lifetime and honorary, separated by commas.' })
  status?: string;
}

export class LedgerQueryDto {
  @ApiProperty({ required: false, example: '2026', description: 'a membership year label, as in `years`' })
  @IsOptional()
  @IsString({ message: 'Choose a membership year from the list.' })
  @MaxLength(32, { message: 'Choose a membership year from the list.' })
  year?: string;

  @ApiProperty({ required: false })
  @IsOptional()
  @ValidateIf((_, v) => v !== '')
  @Type(() => Number)
  @IsInt({ message: 'Choose a plan from the list.' })
  planId?: number;

  @ApiProperty({ required: false, enum: INVOICE_STATUSES })
  @IsOptional()
  @ValidateIf((_, v) => v !== '')
  @IsIn([...INVOICE_STATUSES], { message: 'Choose open, paid, void, refunded or partially_refunded.' })
  status?: InvoiceStatus;

  @ApiProperty({ required: false, enum: PAYMENT_METHODS })
  @IsOptional()
  @ValidateIf((_, v) => v !== '')
  @IsIn([...PAYMENT_METHODS], { message: 'Choose card, cash or cheque.' })
  method?: PaymentMethod;
}
