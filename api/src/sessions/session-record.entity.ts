import { Entity, PrimaryKey, Property } from '@mikro-orm/core';

/** The table express-mysql-session reads and writes; mapped so migrations own its schema. */
@Entity({ tableName: 'sessions' })
export class SessionRecord {
  @PrimaryKey({ type: 'string', length: 128, fieldName: 'session_id', columnType: 'varchar(128)' })
  sessionId!: string;

  @Property({ type: 'integer', unsigned: true, fieldName: 'expires', index: true })
  expires!: number;

  @Property({ type: 'text', columnType: 'mediumtext', fieldName: 'data', nullable: true })
  data?: string;
}
