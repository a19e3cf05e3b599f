import { Entity, Index, PrimaryKey, Property } from '@mikro-orm/core';

/** Failed sign-ins, counted in the database so every api instance sees the same totals. */
@Entity({ tableName: 'sign_in_failures' })
@Index({ properties: ['email', 'createdAt'] })
@Index({ properties: ['address', 'createdAt'] })
export class SignInFailure {
  @PrimaryKey({ type: 'bigint', autoincrement: true })
  id!: string;

  @Property({ type: 'string', length: 254 })
  email!: string;

  @Property({ type: 'string', length: 64 })
  address!: string;

  @Property({ type: 'datetime', length: 3 })
  createdAt: Date = new Date();
}
