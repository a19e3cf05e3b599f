/**
 * The ballots of shows whose voting is open, kept in memory because every vote reads one. What a
 * ballot offers (its kind, categories and entries) cannot change once voting opens, but the chair
 * may still correct a title or a category's name: the change forgets the show's ballot here, and an
 * entry also lapses after `maxAgeMs`, so another api instance shows the correction soon after.
 * Provided by a factory in ShowsModule (its constructor takes plain settings, not services).
 */
export class BallotDefinitions<T = unknown> {
  private readonly held = new Map<number, { at: number; value: Promise<T> }>();

  constructor(
    private readonly maxAgeMs = 30_000,
    private readonly maxShows = 200,
    private readonly now: () => number = Date.now,
  ) {}

  /** The cached ballot of a show, if fresh. */
  peek(showId: number): Promise<T> | undefined {
    const hit = this.held.get(showId);
    if (!hit) return undefined;
    if (this.now() - hit.at > this.maxAgeMs) {
      this.held.delete(showId);
      return undefined;
    }
    return hit.value;
  }

  /** The cached ballot, or one built now and kept (a build that fails is not kept). */
  get(showId: number, build: () => Promise<T>): Promise<T> {
    const cached = this.peek(showId);
    if (cached) return cached;
    const value = build();
    this.held.set(showId, { at: this.now(), value });
    value.catch(() => {
      if (this.held.get(showId)?.value === value) this.held.delete(showId);
    });
    if (this.held.size > this.maxShows) this.held.delete(this.held.keys().next().value!);
    return value;
  }

  forget(showId: number): void {
    this.held.delete(showId);
  }
}
