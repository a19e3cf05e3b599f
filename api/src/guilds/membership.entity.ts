import { Entity, Enum, Index, ManyToOne, Property, Unique } from '@mikro-orm/core';
import { BaseEntity } from '../database/base.entity';
import { User } from '../users/user.entity';
import { Guild } from './guild.entity';
import type { Role } from './roles';

export type MembershipStatus = 'active' | 'left';

@Entity({ tableName: 'memberships' })
@Unique({ properties: ['user', 'guild'] })
@Index({ properties: ['guild', 'status'] })
export class Membership extends BaseEntity<'status' | 'roles' | 'joinedAt' | 'leftAt' | 'eraseRequestedAt'> {
  @ManyToOne(() => User, { deleteRule: 'cascade' })
  user!: User;

  @ManyToOne(() => Guild, { deleteRule: 'cascade' })
  guild!: Guild;

  @Property({ type: 'json' })
  roles: Role[] = [];

  @Enum({ items: ['active', 'left'], type: 'string', length: 16 })
  status: MembershipStatus = 'active';

  @Property({ type: 'datetime', length: 3 })
  joinedAt: Date = new Date();

  @Property({ type: 'datetime', length: 3, nullable: true })
  leftAt?: Date | null = null;

  /** She asked, on leaving, for her personal data to be erased (an admin does it). */
  @Property({ type: 'datetime', length: 3, nullable: true })
  eraseRequestedAt?: Date | null = null;
}
