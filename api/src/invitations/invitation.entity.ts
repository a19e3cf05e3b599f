import { Entity, Index, ManyToOne, Property, Unique } from '@mikro-orm/core';
import { BaseEntity } from '../database/base.entity';
import { Guild } from '../guilds/guild.entity';
import type { Role } from '../guilds/roles';
import { User } from '../users/user.entity';

@Entity({ tableName: 'invitations' })
@Index({ properties: ['guild', 'email'] })
export class Invitation extends BaseEntity<'roles'> {
  @ManyToOne(() => Guild, { deleteRule: 'cascade' })
  guild!: Guild;

  @Property({ type: 'string', length: 254 })
  email!: string;

  @Property({ type: 'json' })
  roles: Role[] = [];

  /** SHA-256 of the token in the link; the token itself is never stored. */
  @Property({ type: 'string', length: 64, hidden: true })
  @Unique()
  tokenHash!: string;

  @ManyToOne(() => User, { deleteRule: 'set null', nullable: true })
  invitedBy?: User | null;

  @Property({ type: 'datetime', length: 3 })
  expiresAt!: Date;

  @Property({ type: 'datetime', length: 3, nullable: true })
  acceptedAt?: Date | null;

  @Property({ type: 'datetime', length: 3, nullable: true })
  revokedAt?: Date | null;
}
