import { Entity, ManyToOne, Property, Unique } from '@mikro-orm/core';
import { BaseEntity } from '../database/base.entity';
import { Guild } from '../guilds/guild.entity';
import type { ProrationBand } from './dues-rules';

/** A guild's dues rules; the currency is the guild's own. A guild without a row uses the defaults. */
@Entity({ tableName: 'dues_settings' })
@Unique({ properties: ['guild'] })
export class DuesSettingsRecord extends BaseEntity<'proration'> {
  @ManyToOne(() => Guild, { deleteRule: 'cascade' })
  guild!: Guild;

  @Property({ type: 'tinyint' })
  yearStartMonth!: number;

  @Property({ type: 'tinyint' })
  dueMonth!: number;

  @Property({ type: 'tinyint' })
  dueDay!: number;

  @Property({ type: 'smallint' })
  graceDays!: number;

  @Property({ type: 'integer' })
  lateFeeCents!: number;

  @Property({ type: 'smallint' })
  earlyRenewalDays!: number;

  @Property({ type: 'json' })
  proration: ProrationBand[] = [];
}
