import { Entity, ManyToOne, Property } from '@mikro-orm/core';
import { BaseEntity } from '../database/base.entity';
import { User } from '../users/user.entity';
import { Round } from './round.entity';

/** A pattern file; the bytes live in the file store under a random key, never the user's name. */
@Entity({ tableName: 'round_files' })
export class RoundFile extends BaseEntity {
  @ManyToOne(() => Round, { deleteRule: 'cascade' })
  round!: Round;

  @Property({ type: 'string', length: 64 })
  storageKey!: string;

  @Property({ type: 'string', length: 255 })
  filename!: string;

  @Property({ type: 'string', length: 64 })
  contentType!: string;

  @Property({ type: 'integer' })
  size!: number;

  @ManyToOne(() => User, { deleteRule: 'set null', nullable: true })
  uploadedBy?: User | null;
}
