import { DecimalType, Entity, Enum, ManyToOne, Property, Unique } from '@mikro-orm/core';
import { BaseEntity } from '../database/base.entity';
import { Show } from './show.entity';

export const SIZE_RULE_KINDS = ['none', 'dimensions', 'perimeter'] as const;
export type SizeRuleKind = (typeof SIZE_RULE_KINDS)[number];

const mm = () => ({ type: new DecimalType('number'), precision: 10, scale: 3, nullable: true });

/** A show category, judged or exhibit only, with an optional size rule (lengths in millimetres). */
@Entity({ tableName: 'show_categories' })
@Unique({ properties: ['show', 'name'] })
export class ShowCategory extends BaseEntity<
  'description' | 'judged' | 'sortOrder' | 'sizeKind' | 'minWidthMm' | 'maxWidthMm' | 'minHeightMm' | 'maxHeightMm' | 'minPerimeterMm' | 'minInclusive' | 'maxPerimeterMm' | 'maxInclusive' | 'minMakers' | 'maxEntriesPerMember'
> {
  @ManyToOne(() => Show, { deleteRule: 'cascade' })
  show!: Show;

  @Property({ type: 'string', length: 80 })
  name!: string;

  @Property({ type: 'string', length: 500 })
  description: string = '';

  @Property({ type: 'boolean' })
  judged: boolean = true;

  @Property({ type: 'smallint' })
  sortOrder: number = 0;

  @Enum({ items: [...SIZE_RULE_KINDS], type: 'string', length: 12 })
  sizeKind: SizeRuleKind = 'none';

  @Property(mm()) minWidthMm?: number | null = null;
  @Property(mm()) maxWidthMm?: number | null = null;
  @Property(mm()) minHeightMm?: number | null = null;
  @Property(mm()) maxHeightMm?: number | null = null;
  @Property(mm()) minPerimeterMm?: number | null = null;
  @Property({ type: 'boolean' }) minInclusive: boolean = true;
  @Property(mm()) maxPerimeterMm?: number | null = null;
  @Property({ type: 'boolean' }) maxInclusive: boolean = true;

  /** Group quilts: 3 or more makers (TRADE.md §6.2). */
  @Property({ type: 'tinyint', nullable: true })
  minMakers?: number | null = null;

  @Property({ type: 'smallint', nullable: true })
  maxEntriesPerMember?: number | null = null;
}
