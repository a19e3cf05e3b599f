import { Entity, Index, ManyToOne, OptionalProps, PrimaryKey, Property, Unique } from '@mikro-orm/core';
import { BaseEntity } from '../database/base.entity';
import { Membership } from '../guilds/membership.entity';
import { ShowCategory } from './show-category.entity';
import { Show } from './show.entity';

/** A visitor's single-use ballot code, printed on a card in a numbered batch. */
@Entity({ tableName: 'ballot_codes' })
@Index({ properties: ['show', 'batch'] })
export class BallotCode extends BaseEntity<'usedAt'> {
  @ManyToOne(() => Show, { deleteRule: 'cascade' })
  show!: Show;

  /** 12 symbols of Crockford Base32, stored without dashes. */
  @Property({ type: 'string', length: 12, columnType: 'char(12)', unique: true })
  code!: string;

  @Property({ type: 'smallint' })
  batch!: number;

  @Property({ type: 'datetime', length: 3, nullable: true })
  usedAt?: Date | null = null;
}

export const VOTER_CHANNELS = ['member', 'code', 'paper'] as const;
export type VoterChannel = (typeof VOTER_CHANNELS)[number];

/**
 * Who has voted, and nothing about how: `voterKey` is "member:<membershipId>" or "code:<codeId>",
 * unique per show, so the database itself refuses a second ballot from the same person or code.
 * The ballot is written in the same transaction, in another table, with no link back to this row.
 */
@Entity({ tableName: 'show_voters' })
@Unique({ properties: ['show', 'voterKey'] })
export class ShowVoter {
  [OptionalProps]?: 'castAt';

  @PrimaryKey({ type: 'integer', autoincrement: true })
  id!: number;

  @ManyToOne(() => Show, { deleteRule: 'cascade' })
  show!: Show;

  @Property({ type: 'string', length: 40 })
  voterKey!: string;

  @Property({ type: 'string', length: 8 })
  channel!: VoterChannel;

  @Property({ type: 'datetime', length: 3 })
  castAt: Date = new Date();
}

/** What a ballot chose: per category (one or many entry ids), or one ranked list for the overall award. */
export interface BallotChoices {
  categories?: Record<string, number[]>;
  ranked?: number[];
}

/**
 * A cast ballot's choices, anonymous by construction: a random id (so row order says nothing about
 * who voted when), no timestamp, no voter.
 */
@Entity({ tableName: 'show_ballots' })
@Index({ properties: ['show'] })
export class ShowBallot {
  @PrimaryKey({ type: 'string', length: 22, columnType: 'char(22)' })
  id!: string;

  @ManyToOne(() => Show, { deleteRule: 'cascade' })
  show!: Show;

  @Property({ type: 'json' })
  choices!: BallotChoices;
}

/** The chair's recorded decision settling a tie in one category (or the overall award). */
@Entity({ tableName: 'show_tie_decisions' })
export class TieDecisionRecord extends BaseEntity<'note'> {
  @ManyToOne(() => Show, { deleteRule: 'cascade' })
  show!: Show;

  @ManyToOne(() => ShowCategory, { nullable: true, deleteRule: 'cascade' })
  category?: ShowCategory | null;

  /** The tied entries' ids, best first. */
  @Property({ type: 'json' })
  entryOrder!: number[];

  @Property({ type: 'string', length: 300 })
  note: string = '';

  @ManyToOne(() => Membership, { nullable: true, deleteRule: 'set null' })
  decidedBy?: Membership | null;

  @Property({ type: 'string', length: 120 })
  decidedByName!: string;
}
