import { Entity, Enum, Index, ManyToOne, OptionalProps, PrimaryKey, Property } from '@mikro-orm/core';
import { Guild } from '../guilds/guild.entity';
import { Membership } from '../guilds/membership.entity';
import { ROLES, type Role } from '../guilds/roles';

/**
 * One person's time in one office: she holds `role` from `startsOn` (guild-local date, included)
 * until `endsOn` (excluded: her access ends on that day), or with no end while `endsOn` is null.
 * Terms are never deleted, so the guild keeps its history of handovers.
 */
@Entity({ tableName: 'office_terms' })
@Index({ properties: ['membership', 'role'] })
@Index({ properties: ['guild', 'role', 'startsOn'] })
export class OfficeTerm {
  [OptionalProps]?: 'createdAt' | 'endsOn' | 'recordedBy' | 'note';

  @PrimaryKey({ type: 'integer', autoincrement: true })
  id!: number;

  @ManyToOne(() => Guild, { deleteRule: 'cascade' })
  guild!: Guild;

  @ManyToOne(() => Membership, { deleteRule: 'cascade' })
  membership!: Membership;

  @Enum({ items: [...ROLES], type: 'string', length: 32 })
  role!: Role;

  @Property({ type: 'date' })
  startsOn!: string;

  @Property({ type: 'date', nullable: true })
  endsOn: string | null = null;

  /** The admin who recorded it; null for terms carried over from the roles list or recorded by the system. */
  @ManyToOne(() => Membership, { nullable: true, deleteRule: 'set null' })
  recordedBy: Membership | null = null;

  @Property({ type: 'datetime', length: 3, onCreate: () => new Date() })
  createdAt: Date = new Date();

  @Property({ type: 'string', length: 300 })
  note: string = '';
}
