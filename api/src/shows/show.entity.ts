import { DecimalType, Entity, Enum, ManyToOne, Property } from '@mikro-orm/core';
import { BaseEntity } from '../database/base.entity';
import { Guild } from '../guilds/guild.entity';
import { Membership } from '../guilds/membership.entity';

export const VOTING_KINDS = ['per_category', 'approval', 'ranked'] as const;
export type VotingKind = (typeof VOTING_KINDS)[number];
export const RANKED_METHODS = ['points', 'instant_runoff'] as const;
export type RankedMethod = (typeof RANKED_METHODS)[number];

const mm = (nullable: boolean) => ({ type: new DecimalType('number'), precision: 10, scale: 3, nullable });

/** One of the guild's quilt shows: its entry rules, its sleeve rule and its viewer's choice ballot. */
@Entity({ tableName: 'shows' })
export class Show extends BaseEntity<
  | 'description' | 'entriesOpenOn' | 'entriesCloseOn' | 'maxEntriesPerMember' | 'entryFeeCents' | 'entryFeeCapCents'
  | 'sleeveDepthMm' | 'narrowUnderMm' | 'narrowDepthMm' | 'splitOverMm' | 'votingKind' | 'rankedMethod' | 'rankDepth'
  | 'votingOpensAt' | 'votingClosesAt' | 'votingOpenedAt' | 'votingClosedAt' | 'resultsPublishedAt' | 'makersHidden'
> {
  @ManyToOne(() => Guild, { deleteRule: 'cascade' })
  guild!: Guild;

  @Property({ type: 'string', length: 120 })
  name!: string;

  @Property({ type: 'string', length: 200 })
  venue!: string;

  @Property({ type: 'text' })
  description: string = '';

  @Property({ type: 'date' })
  startsOn!: string;

  @Property({ type: 'date' })
  endsOn!: string;

  /** Members may enter from this guild-local date to entriesCloseOn, both included. */
  @Property({ type: 'date', nullable: true })
  entriesOpenOn?: string | null = null;

  @Property({ type: 'date', nullable: true })
  entriesCloseOn?: string | null = null;

  @Property({ type: 'smallint', nullable: true })
  maxEntriesPerMember?: number | null = null;

  @Property({ type: 'integer' })
  entryFeeCents: number = 0;

  /** Most one member pays in entry fees for the show, however many quilts she enters. */
  @Property({ type: 'integer', nullable: true })
  entryFeeCapCents?: number | null = null;

  @Property(mm(false))
  sleeveDepthMm: number = 101.6;

  @Property(mm(true))
  narrowUnderMm?: number | null = 762;

  @Property(mm(true))
  narrowDepthMm?: number | null = 76.2;

  @Property(mm(true))
  splitOverMm?: number | null = 2286;

  @Enum({ items: [...VOTING_KINDS], type: 'string', length: 16 })
  votingKind: VotingKind = 'per_category';

  @Enum({ items: [...RANKED_METHODS], type: 'string', length: 16 })
  rankedMethod: RankedMethod = 'points';

  /** Places on a ranked ballot (3 for 3/2/1 points). */
  @Property({ type: 'tinyint' })
  rankDepth: number = 3;

  /** The chair's schedule; the ballot opens and closes by itself at these instants. */
  @Property({ type: 'datetime', length: 3, nullable: true })
  votingOpensAt?: Date | null = null;

  @Property({ type: 'datetime', length: 3, nullable: true })
  votingClosesAt?: Date | null = null;

  /** When the chair opened voting by hand (or the schedule's opening was first seen). */
  @Property({ type: 'datetime', length: 3, nullable: true })
  votingOpenedAt?: Date | null = null;

  /** Closing is final: no ballot is taken after this. */
  @Property({ type: 'datetime', length: 3, nullable: true })
  votingClosedAt?: Date | null = null;

  @Property({ type: 'datetime', length: 3, nullable: true })
  resultsPublishedAt?: Date | null = null;

  /** Hang tags and the public pages hide makers' names until the chair says judging is done. */
  @Property({ type: 'boolean' })
  makersHidden: boolean = true;

  @ManyToOne(() => Membership, { nullable: true, deleteRule: 'set null' })
  createdBy?: Membership | null;
}
