import { Entity, Property, Unique } from '@mikro-orm/core';
import { BaseEntity } from '../database/base.entity';

@Entity({ tableName: 'users' })
export class User extends BaseEntity<'remindersOff' | 'phone' | 'town' | 'showEmail' | 'showPhone' | 'showTown'> {
  /** Stored lower-cased and trimmed; one account per address. */
  @Property({ type: 'string', length: 254 })
  @Unique()
  email!: string;

  @Property({ type: 'string', length: 120 })
  name!: string;

  @Property({ type: 'string', length: 255, hidden: true, lazy: true })
  passwordHash!: string;

  @Property({ type: 'datetime', length: 3, nullable: true })
  lastSignInAt?: Date | null;

  /** She turned reminder e-mails off (profile page or a one-click link); transactional mail still goes. */
  @Property({ type: 'boolean' })
  remindersOff: boolean = false;

  @Property({ type: 'string', length: 40, nullable: true })
  phone?: string | null = null;

  @Property({ type: 'string', length: 120, nullable: true })
  town?: string | null = null;

  /** What other members see in a guild's directory (officers who keep the roster see everything). */
  @Property({ type: 'boolean' })
  showEmail: boolean = false;

  @Property({ type: 'boolean' })
  showPhone: boolean = false;

  @Property({ type: 'boolean' })
  showTown: boolean = false;
}
