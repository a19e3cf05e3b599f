import request from 'supertest';
import { createScenario, createTestApp, ORIGIN, signIn, TestApp } from './helpers';

describe('the layout planner endpoint', () => {
  let t: TestApp;
  let agent: Awaited<ReturnType<typeof signIn>>;

  beforeAll(async () => {
    t = await createTestApp();
    const s = await createScenario(t);
    agent = await signIn(t, s.member.email);
  });
  afterAll(() => t.close());

  it('plans 30 blocks of 12 inches as 5 x 6 with 3 inch sashing and border: 78 x 93 (TRADE.md §3.3, S44)', async () => {
    const res = await agent
      .post('/api/layout-plans')
      .send({ blockCount: 30, blockWidth: '12', blockHeight: '12', sashing: '3', borders: ['3'], rows: 6, columns: 5 });
    expect(res.status).toBe(200);
    expect(res.body.plan.top).toEqual({ width: 78, height: 93 });
    expect(res.body.leftover).toBe(0);
    expect(res.body.svg).toMatch(/^<svg[^>]*viewBox="0 0 78 93"/);
    expect(res.body.arrangements[0]).toMatchObject({ rows: 6, columns: 5, leftover: 0 });
  });

  it('gives binding for a 96 x 110 top as 424 inches in 11 strips (TRADE.md §3.6, S49)', async () => {
    // 8 x 10 blocks of 12 = 96 x 120 would not match; 96 x 110 needs blocks of 12 x 11.
    const res = await agent
      .post('/api/layout-plans')
      .send({ blockCount: 80, blockWidth: '12', blockHeight: '11', rows: 10, columns: 8 });
    expect(res.body.plan.top).toEqual({ width: 96, height: 110 });
    expect(res.body.plan.binding).toMatchObject({ length: 424, strips: 11, fabric: 27.5 });
  });

  it('refuses nonsense with a message, not a 500', async () => {
    const cases = [
      { blockCount: 0, blockWidth: '12', blockHeight: '12' },
      { blockCount: 10, blockWidth: 'twelve', blockHeight: '12' },
      { blockCount: 10, blockWidth: '12', blockHeight: '-3' },
      { blockCount: 10, blockWidth: '12', blockHeight: '12', rows: 5, columns: 5 },
    ];
    for (const body of cases) {
      const res = await agent.post('/api/layout-plans').send(body);
      expect(res.status).toBe(400);
      expect(res.body.message).toBeTruthy();
    }
    expect((await request(t.http).post('/api/layout-plans').set('Origin', ORIGIN).send(cases[0])).status).toBe(401);
  });
});
