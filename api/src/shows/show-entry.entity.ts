import { DecimalType, Entity, Enum, Index, ManyToOne, Property, Unique } from '@mikro-orm/core';
import { BaseEntity } from '../database/base.entity';
import { Membership } from '../guilds/membership.entity';
import { ShowCategory } from './show-category.entity';
import { Show } from './show.entity';

export const ENTRY_STATUSES = ['submitted', 'accepted', 'declined', 'withdrawn'] as const;
export type EntryStatus = (typeof ENTRY_STATUSES)[number];

const mm = () => ({ type: new DecimalType('number'), precision: 10, scale: 3 });

/** A quilt entered in a show. */
@Entity({ tableName: 'show_entries' })
@Unique({ properties: ['show', 'entryNumber'] })
@Index({ properties: ['show', 'status'] })
export class ShowEntry extends BaseEntity<
  'techniques' | 'story' | 'forSale' | 'priceCents' | 'photoKey' | 'photoThumbKey' | 'status' | 'declineReason' | 'entryNumber' | 'enteredBy' | 'reviewedAt' | 'quilter'
> {
  @ManyToOne(() => Show, { deleteRule: 'cascade' })
  show!: Show;

  @ManyToOne(() => ShowCategory, { deleteRule: 'restrict' })
  category!: ShowCategory;

  /** The member the quilt is entered for. */
  @ManyToOne(() => Membership, { deleteRule: 'restrict' })
  membership!: Membership;

  /** The officer who entered it on her behalf, if someone did. */
  @ManyToOne(() => Membership, { nullable: true, deleteRule: 'set null' })
  enteredBy?: Membership | null = null;

  @Property({ type: 'string', length: 160 })
  title!: string;

  @Property(mm())
  widthMm!: number;

  @Property(mm())
  heightMm!: number;

  @Property({ type: 'json' })
  makers!: string[];

  @Property({ type: 'string', length: 120 })
  quilter: string = '';

  @Property({ type: 'string', length: 300 })
  techniques: string = '';

  @Property({ type: 'text' })
  story: string = '';

  @Property({ type: 'boolean' })
  forSale: boolean = false;

  @Property({ type: 'integer', nullable: true })
  priceCents?: number | null = null;

  /** The photo as shown (long edge 1280 px, JPEG) and its thumbnail; the original is not kept. */
  @Property({ type: 'string', length: 80, nullable: true })
  photoKey?: string | null = null;

  @Property({ type: 'string', length: 80, nullable: true })
  photoThumbKey?: string | null = null;

  @Enum({ items: [...ENTRY_STATUSES], type: 'string', length: 12 })
  status: EntryStatus = 'submitted';

  @Property({ type: 'string', length: 500, nullable: true })
  declineReason?: string | null = null;

  @Property({ type: 'smallint', nullable: true })
  entryNumber?: number | null = null;

  @Property({ type: 'datetime', length: 3, nullable: true })
  reviewedAt?: Date | null = null;
}
