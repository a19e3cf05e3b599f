import { withNamedLock } from '../src/database/named-lock';
import { createTestApp, TestApp, unique } from './helpers';

describe('withNamedLock (real MariaDB GET_LOCK)', () => {
  let a: TestApp;
  let b: TestApp;

  beforeAll(async () => {
    a = await createTestApp();
    b = await createTestApp();
  });
  afterAll(async () => {
    await a.close();
    await b.close();
  });

  it('lets one of two api instances run the job; the other skips it', async () => {
    const name = unique('lock');
    let runs = 0;
    let release!: () => void;
    const held = new Promise<void>((r) => (release = r));
    const first = withNamedLock(a.orm, name, async () => {
      runs++;
      await held;
    });
    await new Promise((r) => setTimeout(r, 100));
    const second = await withNamedLock(b.orm, name, async () => {
      runs++;
    });
    expect(second).toBe(false);
    release();
    expect(await first).toBe(true);
    expect(runs).toBe(1);
    // Released: the next run gets it.
    expect(await withNamedLock(b.orm, name, async () => void runs++)).toBe(true);
    expect(runs).toBe(2);
  });

  it('releases the lock when the job throws', async () => {
    const name = unique('lock');
    await expect(withNamedLock(a.orm, name, async () => Promise.reject(new Error('boom')))).rejects.toThrow('boom');
    expect(await withNamedLock(b.orm, name, async () => undefined)).toBe(true);
  });
});
