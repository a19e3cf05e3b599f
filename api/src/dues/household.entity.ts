import { Entity, ManyToOne, Property, Unique } from '@mikro-orm/core';
import { BaseEntity } from '../database/base.entity';
import { Guild } from '../guilds/guild.entity';

/** Members who share one household plan: one payment covers them all. */
@Entity({ tableName: 'households' })
@Unique({ properties: ['guild', 'name'] })
export class Household extends BaseEntity {
  @ManyToOne(() => Guild, { deleteRule: 'cascade' })
  guild!: Guild;

  @Property({ type: 'string', length: 120 })
  name!: string;
}
