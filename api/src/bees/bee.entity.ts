import { Entity, Enum, ManyToOne, Property } from '@mikro-orm/core';
import { BaseEntity } from '../database/base.entity';
import { Guild } from '../guilds/guild.entity';
import { Membership } from '../guilds/membership.entity';

export type Handover = 'mail' | 'meeting';

/** A small group inside a guild that swaps blocks: each month one maker is queen. */
@Entity({ tableName: 'bees' })
export class Bee extends BaseEntity<'handover' | 'startMonth' | 'months' | 'skippedMonths' | 'rotationOrder'> {
  @ManyToOne(() => Guild, { deleteRule: 'cascade' })
  guild!: Guild;

  @Property({ type: 'string', length: 120 })
  name!: string;

  @Property({ type: 'text', nullable: true })
  description?: string | null;

  @ManyToOne(() => Membership, { deleteRule: 'restrict' })
  organiser!: Membership;

  @Enum({ items: ['mail', 'meeting'], type: 'string', length: 16 })
  handover: Handover = 'meeting';

  /** First month of the bee, "YYYY-MM". */
  @Property({ type: 'string', length: 7, columnType: 'char(7)' })
  startMonth: string = '2026-01';

  @Property({ type: 'tinyint' })
  months: number = 12;

  @Property({ type: 'json' })
  skippedMonths: string[] = [];

  /** The queen order the rotation was planned from (membership ids), shuffled or set by hand. */
  @Property({ type: 'json' })
  rotationOrder: number[] = [];

  @Property({ type: 'string', length: 32, nullable: true })
  rotationSeed?: string | null;
}
