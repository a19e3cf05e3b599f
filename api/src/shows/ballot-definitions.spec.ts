import { BallotDefinitions } from './ballot-definitions';

describe('cached ballots', () => {
  it('builds once, then serves the same ballot until forgotten or stale', async () => {
    let clock = 0;
    const cache = new BallotDefinitions<string>(30_000, 200, () => clock);
    let builds = 0;
    const build = () => Promise.resolve(`ballot ${++builds}`);
    expect(await cache.get(1, build)).toBe('ballot 1');
    expect(await cache.get(1, build)).toBe('ballot 1');
    cache.forget(1);
    expect(cache.peek(1)).toBeUndefined();
    expect(await cache.get(1, build)).toBe('ballot 2');
    clock = 30_001;
    expect(cache.peek(1)).toBeUndefined();
    expect(await cache.get(1, build)).toBe('ballot 3');
  });

  it('does not keep a build that failed, and keeps at most the newest shows', async () => {
    const cache = new BallotDefinitions<string>(30_000, 2);
    await expect(cache.get(1, () => Promise.reject(new Error('db down')))).rejects.toThrow('db down');
    expect(cache.peek(1)).toBeUndefined();
    for (const id of [1, 2, 3]) await cache.get(id, () => Promise.resolve(`b${id}`));
    expect(cache.peek(1)).toBeUndefined();
    expect(await cache.peek(3)).toBe('b3');
  });
});
