import { Entity, ManyToOne, Property } from '@mikro-orm/core';
import { BaseEntity } from '../database/base.entity';
import { Guild } from '../guilds/guild.entity';
import { Membership } from '../guilds/membership.entity';

/** A small group inside a guild that swaps blocks; rounds and rotations come with the bees feature. */
@Entity({ tableName: 'bees' })
export class Bee extends BaseEntity {
  @ManyToOne(() => Guild, { deleteRule: 'cascade' })
  guild!: Guild;

  @Property({ type: 'string', length: 120 })
  name!: string;

  @Property({ type: 'text', nullable: true })
  description?: string | null;

  @ManyToOne(() => Membership, { deleteRule: 'restrict' })
  organiser!: Membership;
}
