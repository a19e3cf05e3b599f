import { DecimalType, Entity, Enum, Index, ManyToOne, Property, Unique } from '@mikro-orm/core';
import { Bee } from '../bees/bee.entity';
import { BaseEntity } from '../database/base.entity';
import { Membership } from '../guilds/membership.entity';

export type TrimMode = 'trim' | 'untrimmed';
export type FabricSource = 'stash' | 'queen_sends';
export type RoundStatus = 'draft' | 'published';
export interface Swatch {
  name: string;
  hex: string;
}

const mm = () => ({ type: new DecimalType('number'), precision: 10, scale: 3 });

/** A month's block assignment, set by that month's queen. Lengths in millimetres. */
@Entity({ tableName: 'rounds' })
@Unique({ properties: ['bee', 'month'] })
@Index({ properties: ['status', 'sendAt'] })
export class Round extends BaseEntity<'status' | 'swatches' | 'changeBatch' | 'changedFields'> {
  @ManyToOne(() => Bee, { deleteRule: 'cascade' })
  bee!: Bee;

  @Property({ type: 'string', length: 7, columnType: 'char(7)' })
  month!: string;

  @ManyToOne(() => Membership, { deleteRule: 'restrict' })
  queen!: Membership;

  @Property({ type: 'string', length: 160 })
  title!: string;

  /** Markdown as the queen typed it; rendered to safe HTML on the way out. */
  @Property({ type: 'text' })
  instructions!: string;

  @Property({ type: 'string', length: 500, nullable: true })
  patternLink?: string | null;

  @Property(mm())
  finishedWidthMm!: number;

  @Property(mm())
  finishedHeightMm!: number;

  @Property(mm())
  seamAllowanceMm!: number;

  @Property(mm())
  toleranceMm!: number;

  @Enum({ items: ['trim', 'untrimmed'], type: 'string', length: 16 })
  trimMode!: TrimMode;

  @Property({ type: 'json' })
  swatches: Swatch[] = [];

  @Property({ type: 'json', nullable: true })
  background?: Swatch | null;

  @Enum({ items: ['stash', 'queen_sends'], type: 'string', length: 16 })
  fabricSource!: FabricSource;

  /** "YYYY-MM-DD" in the guild's time zone. */
  @Property({ type: 'string', length: 10, columnType: 'char(10)' })
  dueDate!: string;

  @Property({ type: 'datetime', length: 3 })
  sendAt!: Date;

  @Enum({ items: ['mail', 'meeting'], type: 'string', length: 16 })
  deliveryMethod!: 'mail' | 'meeting';

  @Property({ type: 'text', nullable: true })
  deliveryAddress?: string | null;

  @Property({ type: 'text', nullable: true })
  meetingDetails?: string | null;

  @Enum({ items: ['draft', 'published'], type: 'string', length: 16 })
  status: RoundStatus = 'draft';

  @Property({ type: 'datetime', length: 3, nullable: true })
  publishedAt?: Date | null;

  @Property({ type: 'datetime', length: 3, nullable: true })
  sentAt?: Date | null;

  /** Edits to a sent round wait here until 30 quiet minutes have passed, then go as one notice. */
  @Property({ type: 'datetime', length: 3, nullable: true })
  changePendingSince?: Date | null;

  @Property({ type: 'datetime', length: 3, nullable: true })
  lastEditedAt?: Date | null;

  @Property({ type: 'json' })
  changedFields: string[] = [];

  @Property({ type: 'integer' })
  changeBatch: number = 0;
}
