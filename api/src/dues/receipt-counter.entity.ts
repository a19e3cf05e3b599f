import { Entity, ManyToOne, Property, Unique } from '@mikro-orm/core';
import { BaseEntity } from '../database/base.entity';
import { Guild } from '../guilds/guild.entity';

/** The next receipt number of a guild in a calendar year; taken under SELECT … FOR UPDATE. */
@Entity({ tableName: 'dues_receipt_counters' })
@Unique({ properties: ['guild', 'year'] })
export class ReceiptCounter extends BaseEntity<'nextNumber'> {
  @ManyToOne(() => Guild, { deleteRule: 'cascade' })
  guild!: Guild;

  @Property({ type: 'smallint' })
  year!: number;

  @Property({ type: 'integer' })
  nextNumber: number = 1;
}
