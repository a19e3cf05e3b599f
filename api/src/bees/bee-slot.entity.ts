import { Entity, ManyToOne, Property, Unique } from '@mikro-orm/core';
import { BaseEntity } from '../database/base.entity';
import { Membership } from '../guilds/membership.entity';
import { Bee } from './bee.entity';

/** One month of a bee's rotation: who is queen (derived by the planner), or skipped. */
@Entity({ tableName: 'bee_slots' })
@Unique({ properties: ['bee', 'month'] })
export class BeeSlot extends BaseEntity<'skipped'> {
  @ManyToOne(() => Bee, { deleteRule: 'cascade' })
  bee!: Bee;

  @Property({ type: 'string', length: 7, columnType: 'char(7)' })
  month!: string;

  @ManyToOne(() => Membership, { deleteRule: 'set null', nullable: true })
  queen?: Membership | null;

  @Property({ type: 'boolean' })
  skipped: boolean = false;
}
