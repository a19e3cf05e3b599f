import { DecimalType, Entity, Enum, Index, ManyToOne, Property } from '@mikro-orm/core';
import { BaseEntity } from '../database/base.entity';
import { RoundBlock } from '../rounds/round-block.entity';
import { User } from '../users/user.entity';

export type SizeCheckStatus = 'measured' | 'failed' | 'manual';

const mm = (nullable = true) => ({ type: new DecimalType('number'), precision: 10, scale: 3, nullable });

/** One photo (or ruler reading) of a maker's block and what Selvage made of it. */
@Entity({ tableName: 'size_checks' })
@Index({ properties: ['block', 'createdAt'] })
export class SizeCheck extends BaseEntity<'onBehalf'> {
  @ManyToOne(() => RoundBlock, { deleteRule: 'cascade' })
  block!: RoundBlock;

  @ManyToOne(() => User, { deleteRule: 'set null', nullable: true })
  uploadedBy?: User | null;

  @Property({ type: 'boolean' })
  onBehalf: boolean = false;

  @Enum({ items: ['measured', 'failed', 'manual'], type: 'string', length: 16 })
  status!: SizeCheckStatus;

  /** Why a photo could not be measured, as a code and in plain words. */
  @Property({ type: 'string', length: 32, nullable: true })
  failureReason?: string | null;

  @Property({ type: 'text', nullable: true })
  message?: string | null;

  /** Storage keys (random) of the original and the derived images. */
  @Property({ type: 'json', nullable: true })
  images?: { original: string; display: string; thumb: string; overlay?: string } | null;

  @Property({ type: 'integer', nullable: true })
  photoWidthPx?: number | null;

  @Property({ type: 'integer', nullable: true })
  photoHeightPx?: number | null;

  /** The maker's ruler reading of the card's long bar, and the print scale it implies. */
  @Property(mm())
  rulerReadingMm?: number | null;

  @Property({ type: new DecimalType('number'), precision: 8, scale: 6, nullable: true })
  printScale?: number | null;

  @Property(mm())
  widthMm?: number | null;

  @Property(mm())
  heightMm?: number | null;

  @Property({ type: 'json', nullable: true })
  diagonalsMm?: [number, number] | null;

  @Property({ type: 'json', nullable: true })
  cornerAnglesDeg?: number[] | null;

  /** What the maker's own ruler says, kept beside the photo's figures. */
  @Property(mm())
  manualWidthMm?: number | null;

  @Property(mm())
  manualHeightMm?: number | null;

  @Property({ type: 'string', length: 16, nullable: true })
  verdict?: string | null;

  @Property({ type: 'boolean', nullable: true })
  outOfSquare?: boolean | null;

  @Property({ type: 'text', nullable: true })
  summary?: string | null;

  @Property({ type: 'integer', nullable: true })
  processingMs?: number | null;
}
