import { DuesInvoice } from '../src/dues/dues-invoice.entity';
import { createScenario, createTestApp, eventually, pdfText, signIn, startPaymentsHarness, waitForMail, type PaymentsHarness, type TestApp } from './helpers';
import { setUpShow } from './shows-helpers';

const sessionOf = (url: string) => url.split('/pay/')[1];

/** A show's entry fees paid by card through the dues checkout, webhook, receipts and ledger (real MariaDB, payments fake). */
describe('quilt show: entry fees through the payment flow', () => {
  let h: PaymentsHarness;
  let t: TestApp;
  beforeAll(async () => {
    h = await startPaymentsHarness();
    t = await createTestApp();
    h.attach(t);
  });
  afterAll(async () => {
    await t.close();
    await h.close();
  });

  it('charges $5 a quilt capped at $12, takes the card payment, sends the receipt and asks only for the difference later', async () => {
    const s = await createScenario(t);
    const chair = await signIn(t, s.showChair.email);
    const member = await signIn(t, s.member.email);
    const treasurer = await signIn(t, s.treasurer.email);
    const { showId, medium } = await setUpShow(chair, s.guild.id, { entryFeeCents: 500, entryFeeCapCents: 1200 });
    const base = `/api/guilds/${s.guild.id}/shows/${showId}`;
    const enter = (title: string) => member.post(`${base}/entries`).send({ categoryId: medium, title, widthIn: '50', heightIn: '60', makers: ['Me'] }).expect(201);

    expect((await member.get(base).expect(200)).body.entryFeeText).toBe('$5.00 per quilt, at most $12.00 per member');
    await member.post(`${base}/fees/checkout`).expect(409); // nothing entered yet
    await enter('First');
    await enter('Second');
    let fees = (await member.get(`${base}/fees/mine`).expect(200)).body;
    expect(fees).toMatchObject({ quilts: 2, owedCents: 1000, paidCents: 0, dueCents: 1000, canPayOnline: true });

    const started = await member.post(`${base}/fees/checkout`).expect(201);
    const again = await member.post(`${base}/fees/checkout`).expect(201);
    expect(again.body).toEqual(started.body); // a double click reuses the session
    expect((await h.pay(sessionOf(started.body.url))).status).toBe(200);
    await h.drained();
    const invoice = await eventually(async () => {
      const i = await t.orm.em.fork().findOne(DuesInvoice, { id: started.body.invoiceId });
      return i?.status === 'paid' ? i : undefined;
    });
    expect(invoice).toMatchObject({ purpose: 'show_entry', showId, totalCents: 1000 });
    expect(invoice.lines).toEqual([{ kind: 'entry-fee', label: 'Entry fees, Harvest Show: 2 quilts at $5.00', amountCents: 1000 }]);
    const mail = await waitForMail(s.member.email, (m) => m.subject.includes(invoice.receiptNumber!));
    expect(mail.text).toContain('quilt entry fees for Harvest Show');
    expect(pdfText(Buffer.from(mail.attachments![0].contentBase64, 'base64'))).toContain('Entry fees, Harvest Show: 2 quilts at $5.00');

    // The treasurer's ledger has it beside the dues.
    const ledger = (await treasurer.get(`/api/guilds/${s.guild.id}/dues/ledger`).expect(200)).body;
    expect(ledger.rows.find((r: { invoiceId: number }) => r.invoiceId === invoice.id)).toMatchObject({ planName: 'Show entry fees', grossCents: 1000 });

    // A third quilt: $15 capped at $12, less $10 paid → $2.
    await enter('Third');
    fees = (await member.get(`${base}/fees/mine`).expect(200)).body;
    expect(fees).toMatchObject({ quilts: 3, owedCents: 1200, paidCents: 1000, dueCents: 200 });
    const more = await member.post(`${base}/fees/checkout`).expect(201);
    const second = await t.orm.em.fork().findOneOrFail(DuesInvoice, { id: more.body.invoiceId });
    expect(second.lines[0]).toEqual({ kind: 'entry-fee', label: 'Entry fees, Harvest Show: 3 quilts at $5.00, capped at $12.00, less $10.00 already paid', amountCents: 200 });

    // Paying dues does not void the open entry-fee invoice (each purpose has its own open invoice).
    const plan = await treasurer.post(`/api/guilds/${s.guild.id}/dues/plans`).send({ name: 'Regular', kind: 'standard', yearlyCents: 3000 }).expect(201);
    await member.post(`/api/guilds/${s.guild.id}/dues/checkout`).send({ planId: plan.body.id }).expect(201);
    expect((await t.orm.em.fork().findOneOrFail(DuesInvoice, { id: second.id })).status).toBe('open');
    const me = (await member.get(`/api/guilds/${s.guild.id}/dues/me`).expect(200)).body;
    expect(me.openInvoice.id).not.toBe(second.id);
    expect(me.history.map((x: { label: string }) => x.label)).toContain('Entry fees: Harvest Show');
  });

  it('refuses to take fees for a show without one', async () => {
    const s = await createScenario(t);
    const chair = await signIn(t, s.showChair.email);
    const { showId } = await setUpShow(chair, s.guild.id);
    const res = await chair.post(`/api/guilds/${s.guild.id}/shows/${showId}/fees/checkout`).expect(409);
    expect(res.body.message).toBe('Harvest Show has no entry fee.');
    expect((await chair.get(`/api/guilds/${s.guild.id}/shows/${showId}/fees/mine`).expect(200)).body).toMatchObject({ feeText: null, dueCents: 0 });
  });
});
