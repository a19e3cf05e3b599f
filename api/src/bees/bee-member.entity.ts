import { Entity, Enum, ManyToOne, Property, Unique } from '@mikro-orm/core';
import { BaseEntity } from '../database/base.entity';
import { Membership } from '../guilds/membership.entity';
import { Bee } from './bee.entity';

export type BeeMemberStatus = 'invited' | 'active' | 'left';

@Entity({ tableName: 'bee_members' })
@Unique({ properties: ['bee', 'membership'] })
export class BeeMember extends BaseEntity<'status'> {
  @ManyToOne(() => Bee, { deleteRule: 'cascade' })
  bee!: Bee;

  @ManyToOne(() => Membership, { deleteRule: 'cascade' })
  membership!: Membership;

  @Enum({ items: ['invited', 'active', 'left'], type: 'string', length: 16 })
  status: BeeMemberStatus = 'active';

  @Property({ type: 'datetime', length: 3, nullable: true })
  joinedAt?: Date | null;

  @Property({ type: 'datetime', length: 3, nullable: true })
  leftAt?: Date | null;
}
