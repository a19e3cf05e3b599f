import { OptionalProps, PrimaryKey, Property } from '@mikro-orm/core';

/** `Optional` names the properties that have defaults, so `em.create` does not demand them. */
export abstract class BaseEntity<Optional extends string = never> {
  [OptionalProps]?: 'createdAt' | 'updatedAt' | Optional;

  @PrimaryKey({ type: 'integer', autoincrement: true })
  id!: number;

  @Property({ type: 'datetime', length: 3, onCreate: () => new Date() })
  createdAt: Date = new Date();

  @Property({ type: 'datetime', length: 3, onCreate: () => new Date(), onUpdate: () => new Date() })
  updatedAt: Date = new Date();
}
