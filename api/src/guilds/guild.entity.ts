import { Entity, Property } from '@mikro-orm/core';
import { BaseEntity } from '../database/base.entity';

@Entity({ tableName: 'guilds' })
export class Guild extends BaseEntity<'timeZone' | 'currency' | 'unit' | 'yearStartMonth'> {
  @Property({ type: 'string', length: 120 })
  name!: string;

  @Property({ type: 'string', length: 120 })
  town!: string;

  /** IANA zone; membership years, due dates and monthly sends are computed in it. */
  @Property({ type: 'string', length: 64 })
  timeZone: string = 'America/Chicago';

  /** ISO 4217 code; money is kept in integer minor units of it. */
  @Property({ type: 'string', length: 3, columnType: 'char(3)' })
  currency: string = 'USD';

  @Property({ type: 'string', length: 2 })
  unit: 'in' | 'cm' = 'in';

  @Property({ type: 'tinyint' })
  yearStartMonth: number = 1;
}
