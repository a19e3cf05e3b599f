import { Entity, ManyToOne, Property, Unique } from '@mikro-orm/core';
import { BaseEntity } from '../database/base.entity';
import { User } from '../users/user.entity';

@Entity({ tableName: 'password_resets' })
export class PasswordReset extends BaseEntity {
  @ManyToOne(() => User, { deleteRule: 'cascade' })
  user!: User;

  @Property({ type: 'string', length: 64, hidden: true })
  @Unique()
  tokenHash!: string;

  @Property({ type: 'datetime', length: 3 })
  expiresAt!: Date;

  @Property({ type: 'datetime', length: 3, nullable: true })
  usedAt?: Date | null;
}
