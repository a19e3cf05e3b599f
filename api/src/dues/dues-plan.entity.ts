import { Entity, Enum, ManyToOne, Property, Unique } from '@mikro-orm/core';
import { BaseEntity } from '../database/base.entity';
import { Guild } from '../guilds/guild.entity';
import type { PlanKind } from './dues-rules';

export const PLAN_KINDS = ['standard', 'household', 'lifetime', 'honorary'] as const;

/** A membership category and its yearly dues. Invoices copy their lines, so changing it never changes them. */
@Entity({ tableName: 'dues_plans' })
@Unique({ properties: ['guild', 'name'] })
export class DuesPlan extends BaseEntity<'active' | 'minAge' | 'maxAge'> {
  @ManyToOne(() => Guild, { deleteRule: 'cascade' })
  guild!: Guild;

  @Property({ type: 'string', length: 80 })
  name!: string;

  @Enum({ items: [...PLAN_KINDS], type: 'string', length: 16 })
  kind!: PlanKind;

  /** Minor units of the guild's currency; 0 for lifetime and honorary plans. */
  @Property({ type: 'integer' })
  yearlyCents!: number;

  @Property({ type: 'tinyint', nullable: true })
  minAge?: number | null = null;

  @Property({ type: 'tinyint', nullable: true })
  maxAge?: number | null = null;

  @Property({ type: 'boolean' })
  active: boolean = true;
}
