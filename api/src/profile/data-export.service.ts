import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import PDFDocument from 'pdfkit';
import { printable, registerFonts } from '../shows/pdf/pdf-tools';

type Row = Record<string, unknown>;

/**
 * Everything Selvage holds about one person, as JSON and as a readable PDF: her account, her guild
 * memberships, bees, blocks and size checks, dues invoices and payments, show entries, and the shows
 * she voted in. Her ballots' choices are not hers to export: they are stored with no link to her.
 */
@Injectable()
export class DataExportService {
  constructor(private readonly em: EntityManager) {}

  async collect(userId: number) {
    const q = (sql: string, params: unknown[]) => this.em.getConnection().execute<Row[]>(sql, params);
    const [account] = await q(
      'SELECT id, email, name, phone, town, show_email, show_phone, show_town, reminders_off, created_at, last_sign_in_at FROM users WHERE id = ?',
      [userId],
    );
    const memberships = await q(
      'SELECT m.id, g.name AS guild, g.town AS guild_town, m.roles, m.status, m.joined_at FROM memberships m JOIN guilds g ON g.id = m.guild_id WHERE m.user_id = ? ORDER BY m.id',
      [userId],
    );
    const ids = memberships.map((m) => m.id as number);
    const none = ids.length === 0;
    const inList = none ? '(NULL)' : `(${ids.map(() => '?').join(', ')})`;
    const bees = none ? [] : await q(`SELECT b.name AS bee, bm.status, bm.created_at FROM bee_members bm JOIN bees b ON b.id = bm.bee_id WHERE bm.membership_id IN ${inList} ORDER BY bm.id`, ids);
    const blocks = none
      ? []
      : await q(
          `SELECT b.name AS bee, r.month, r.title, rb.status, rb.created_at, rb.updated_at FROM round_blocks rb JOIN rounds r ON r.id = rb.round_id JOIN bees b ON b.id = r.bee_id WHERE rb.maker_id IN ${inList} ORDER BY r.month, rb.id`,
          ids,
        );
    const sizeChecks = await q('SELECT id, created_at, status, width_mm, height_mm FROM size_checks WHERE uploaded_by_id = ? ORDER BY id', [userId]);
    const invoices = none
      ? []
      : await q(
          `SELECT id, purpose, year_label, plan_name, total_cents, refunded_cents, currency, status, method, paid_on, receipt_number, created_at FROM dues_invoices WHERE membership_id IN ${inList} ORDER BY id`,
          ids,
        );
    const entries = none
      ? []
      : await q(
          `SELECT s.name AS show_name, e.title, c.name AS category, e.status, e.entry_number, e.width_mm, e.height_mm, e.makers, e.quilter, e.techniques, e.story, e.for_sale, e.price_cents, e.created_at
             FROM show_entries e JOIN shows s ON s.id = e.show_id JOIN show_categories c ON c.id = e.category_id WHERE e.membership_id IN ${inList} ORDER BY e.id`,
          ids,
        );
    const offices = none
      ? []
      : await q(
          `SELECT g.name AS guild, t.role, DATE_FORMAT(t.starts_on, '%Y-%m-%d') AS starts_on, DATE_FORMAT(t.ends_on, '%Y-%m-%d') AS access_ends_on, t.note
             FROM office_terms t JOIN guilds g ON g.id = t.guild_id WHERE t.membership_id IN ${inList} ORDER BY t.starts_on, t.id`,
          ids,
        );
    const voted = none
      ? []
      : await q(`SELECT s.name AS show_name, v.cast_at FROM show_voters v JOIN shows s ON s.id = v.show_id WHERE v.voter_key IN (${ids.map(() => '?').join(', ')}) ORDER BY v.id`, ids.map((id) => `member:${id}`));
    return {
      exportedAt: new Date().toISOString(),
      account,
      memberships,
      bees,
      blocks,
      sizeChecks,
      duesAndFees: invoices,
      showEntries: entries,
      showsVotedIn: voted,
      officesHeld: offices,
      note: 'Viewer’s choice ballots are stored without any link to the voter, so what you chose cannot be looked up or exported.',
    };
  }

  /** The same, readable: one section per kind of record, each record's fields as "name: value" lines. */
  async pdf(userId: number): Promise<Buffer> {
    const data = await this.collect(userId);
    const doc = new PDFDocument({ size: 'LETTER', margin: 54, info: { Title: 'Everything Selvage holds about you', Creator: 'Selvage' } });
    registerFonts(doc);
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    const done = new Promise<Buffer>((resolve) => doc.on('end', () => resolve(Buffer.concat(chunks))));
    const text = (s: string, font: 'regular' | 'bold' = 'regular', size = 12) => doc.font(font).fontSize(size).text(printable(doc, s));
    text('Everything Selvage holds about you', 'bold', 20);
    text(`Exported ${data.exportedAt.slice(0, 10)}`, 'regular', 12);
    doc.moveDown();
    const value = (v: unknown) => (v instanceof Date ? v.toISOString() : typeof v === 'object' && v !== null ? JSON.stringify(v) : String(v ?? '—'));
    const section = (title: string, rows: Row[]) => {
      text(title, 'bold', 15);
      if (!rows.length) text('Nothing.');
      for (const r of rows) {
        for (const [k, v] of Object.entries(r)) text(`${k.replace(/_/g, ' ')}: ${value(v)}`, 'regular', 11);
        doc.moveDown(0.5);
      }
      doc.moveDown();
    };
    section('Your account', data.account ? [data.account] : []);
    section('Guild memberships', data.memberships);
    section('Bees', data.bees);
    section('Blocks', data.blocks);
    section('Size checks of your blocks', data.sizeChecks);
    section('Dues and fees', data.duesAndFees);
    section('Quilt show entries', data.showEntries);
    section('Shows you voted in', data.showsVotedIn);
    section('Offices you held', data.officesHeld);
    text(data.note, 'regular', 11);
    doc.end();
    return done;
  }
}
