import { Entity, Property, Unique } from '@mikro-orm/core';
import { BaseEntity } from '../database/base.entity';

@Entity({ tableName: 'users' })
export class User extends BaseEntity<'remindersOff' | 'phone' | 'town' | 'showEmail' | 'showPhone' | 'showTown' | 'erasedAt'> {
  /**
   * Stored lower-cased and trimmed; one account per address. Null for a member the officers keep on
   * her behalf (no e-mail address: she reads paper and never signs in).
   */
  @Property({ type: 'string', length: 254, nullable: true })
  @Unique()
  email!: string | null;

  @Property({ type: 'string', length: 120 })
  name!: string;

  /** Null until she chooses a password (members added by an officer or by a roster import). */
  @Property({ type: 'string', length: 255, hidden: true, lazy: true, nullable: true })
  passwordHash!: string | null;

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

  /** When an admin erased her personal data after she left (name replaced; money records kept). */
  @Property({ type: 'datetime', length: 3, nullable: true })
  erasedAt?: Date | null = null;
}
