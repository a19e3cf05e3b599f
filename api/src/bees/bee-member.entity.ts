import { Entity, ManyToOne, Unique } from '@mikro-orm/core';
import { BaseEntity } from '../database/base.entity';
import { Membership } from '../guilds/membership.entity';
import { Bee } from './bee.entity';

@Entity({ tableName: 'bee_members' })
@Unique({ properties: ['bee', 'membership'] })
export class BeeMember extends BaseEntity {
  @ManyToOne(() => Bee, { deleteRule: 'cascade' })
  bee!: Bee;

  @ManyToOne(() => Membership, { deleteRule: 'cascade' })
  membership!: Membership;
}
