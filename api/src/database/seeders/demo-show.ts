import type { EntityManager } from '@mikro-orm/core';
import { randomBytes } from 'node:crypto';
import { DateTime } from 'luxon';
import { inchesToMm, roundMm } from '../../common/units/inches';
import { todayIn } from '../../dues/dues-rules';
import type { Guild } from '../../guilds/guild.entity';
import type { Membership } from '../../guilds/membership.entity';
import { generateBallotCode } from '../../shows/ballot-code';
import { BallotCode, ShowBallot, ShowVoter } from '../../shows/ballot.entity';
import { ShowCategory } from '../../shows/show-category.entity';
import { ShowEntry, type EntryStatus } from '../../shows/show-entry.entity';
import { Show } from '../../shows/show.entity';
import { USUAL_PERIMETER_BANDS } from '../../shows/size-rules';
import { appConfig, type AppConfig } from '../../config/app.config';
import { LocalDiskFileStore } from '../../storage/file-store';
import { quiltPhoto } from './demo-quilt-photos';

const mm = (inches: number) => roundMm(inchesToMm(inches));

interface DemoEntry {
  who: string;
  title: string;
  category: string;
  size: [number, number];
  makers?: string[];
  status: EntryStatus;
  story?: string;
  forSaleCents?: number;
  declineReason?: string;
}

/** Invented quilts; sizes chosen to fall inside their categories' rules. */
const SPRING_ENTRIES: DemoEntry[] = [
  { who: 'june', title: 'Blue Hour over Wrenfield Mill', category: 'Medium', size: [56, 62.5], status: 'submitted', story: 'Pieced from my late husband\'s shirts, one block each winter evening.' },
  { who: 'hazel', title: 'Lantern Street in Snow', category: 'Large', size: [72, 84], status: 'accepted', story: 'Hand quilted over two winters.' },
  { who: 'agnes', title: 'Hedgerow Scraps', category: 'Small', size: [36, 40], status: 'accepted', forSaleCents: 18000 },
  { who: 'bernadette', title: 'Pond Weed and Dragonflies', category: 'Miniature', size: [18, 22.25], status: 'accepted' },
  { who: 'clementine', title: 'Sunday Best', category: 'Medium', size: [50, 60], status: 'accepted' },
  { who: 'dolores', title: 'Orchard in Bloom', category: 'Extra large', size: [90, 96], status: 'submitted' },
  { who: 'edith', title: 'Checkerboard Garden', category: 'Medium', size: [48, 64], status: 'declined', declineReason: 'No hanging sleeve was sewn on. Add a 4 in sleeve and enter again.' },
  { who: 'faye', title: 'Friendship Stars for the Mill Fire Fund', category: 'Group quilts', size: [70, 80], makers: ['Faye Brightwater', 'Greta Kessington', 'Harriet Lamberth', 'Imogen Okonkwo-Reyes'], status: 'accepted' },
  { who: 'greta', title: 'Harbour Lights', category: 'Large', size: [66, 80], status: 'submitted' },
];

const AUTUMN_ENTRIES: DemoEntry[] = [
  { who: 'hazel', title: 'Russet and Rain', category: 'Large', size: [70, 82], status: 'accepted' },
  { who: 'priya', title: 'Spice Market Stars', category: 'Large', size: [68, 80], status: 'accepted' },
  { who: 'lottie', title: 'Windfall Apples', category: 'Large', size: [64, 78], status: 'accepted' },
  { who: 'josephine', title: 'Old Mill Wheel', category: 'Large', size: [72, 76], status: 'accepted' },
  { who: 'kathleen', title: 'Fern Hollow', category: 'Medium', size: [50, 60], status: 'accepted' },
  { who: 'lorraine', title: 'Tea at Four', category: 'Medium', size: [48, 56], status: 'accepted' },
  { who: 'marguerite', title: 'Marsh Light', category: 'Medium', size: [54, 60], status: 'accepted' },
  { who: 'nadia', title: 'Little Wren', category: 'Small', size: [30, 36], status: 'accepted' },
  { who: 'opal', title: 'Button Box', category: 'Small', size: [32, 40], status: 'accepted' },
];

const CATEGORIES = [
  ...USUAL_PERIMETER_BANDS.map((b) => ({
    name: b.name,
    description: `Quilts by one or two makers, ${b.name.toLowerCase()} by perimeter.`,
    sizeKind: 'perimeter' as const,
    minPerimeterMm: 'minIn' in b ? mm(b.minIn) : null,
    minInclusive: 'minInclusive' in b ? b.minInclusive : true,
    maxPerimeterMm: 'maxIn' in b ? mm(b.maxIn) : null,
    maxInclusive: 'maxInclusive' in b ? b.maxInclusive : true,
  })),
];

function addCategories(em: EntityManager, show: Show, extra: boolean): Map<string, ShowCategory> {
  const out = new Map<string, ShowCategory>();
  let order = 0;
  for (const c of CATEGORIES) out.set(c.name, em.create(ShowCategory, { show, sortOrder: order++, ...c }));
  if (extra) {
    out.set('Miniature', em.create(ShowCategory, { show, sortOrder: order++, name: 'Miniature', description: 'Small in every way: at most 24 in on each side.', sizeKind: 'dimensions', maxWidthMm: mm(24), maxHeightMm: mm(24) }));
    out.set('Group quilts', em.create(ShowCategory, { show, sortOrder: order++, name: 'Group quilts', description: 'Made by three or more people: bee quilts, raffle and charity quilts.', judged: false, minMakers: 3 }));
  }
  return out;
}

function addEntries(em: EntityManager, show: Show, categories: Map<string, ShowCategory>, list: DemoEntry[], people: Map<string, Membership>, numbered: boolean) {
  let n = 1;
  return list.map((e) => {
    const who = people.get(`${e.who}@wrenfield.example`)!;
    return em.create(ShowEntry, {
      show,
      category: categories.get(e.category)!,
      membership: who,
      enteredBy: who,
      title: e.title,
      widthMm: mm(e.size[0]),
      heightMm: mm(e.size[1]),
      makers: e.makers ?? [who.user.name],
      quilter: e.makers ? e.makers[0] : who.user.name,
      techniques: 'Machine pieced, machine quilted',
      story: e.story ?? '',
      forSale: !!e.forSaleCents,
      priceCents: e.forSaleCents ?? null,
      status: e.status,
      declineReason: e.declineReason ?? null,
      entryNumber: numbered && e.status === 'accepted' ? n++ : null,
      reviewedAt: e.status === 'submitted' ? null : new Date(),
    });
  });
}

/**
 * Two invented shows for Wrenfield: the coming spring show taking entries (some accepted, one
 * declined, June's waiting for review), and last autumn's show with its viewer's choice counted and
 * published, voted by visitors' cards and members.
 */
export async function seedDemoShows(em: EntityManager, guild: Guild, people: Map<string, Membership>): Promise<void> {
  const today = DateTime.fromISO(todayIn(guild.timeZone), { zone: guild.timeZone });
  const chair = people.get('priya@wrenfield.example')!;
  const spring = em.create(Show, {
    guild,
    name: 'Wrenfield Spring Quilt Show',
    venue: 'Wrenfield Grange Hall, 4 Mill Lane',
    description: 'Our yearly show. Bring quilts to the hall on the Thursday before, 4 to 7 pm. Please use a lint roller before drop-off.',
    startsOn: today.plus({ days: 60 }).toISODate()!,
    endsOn: today.plus({ days: 61 }).toISODate()!,
    entriesOpenOn: today.minus({ days: 30 }).toISODate()!,
    entriesCloseOn: today.plus({ days: 45 }).toISODate()!,
    maxEntriesPerMember: 3,
    entryFeeCents: 500,
    entryFeeCapCents: 2500,
    createdBy: chair,
  });
  const springEntries = addEntries(em, spring, addCategories(em, spring, true), SPRING_ENTRIES, people, false);

  const closed = today.minus({ months: 2 }).set({ hour: 16, minute: 0 });
  const autumn = em.create(Show, {
    guild,
    name: 'Autumn Harvest Show',
    venue: 'Wrenfield Library Hall',
    startsOn: closed.minus({ days: 1 }).toISODate()!,
    endsOn: closed.toISODate()!,
    entriesOpenOn: closed.minus({ days: 60 }).toISODate()!,
    entriesCloseOn: closed.minus({ days: 14 }).toISODate()!,
    votingOpenedAt: closed.minus({ days: 1 }).set({ hour: 10 }).toJSDate(),
    votingClosedAt: closed.toJSDate(),
    resultsPublishedAt: closed.plus({ hours: 2 }).toJSDate(),
    makersHidden: false,
    createdBy: chair,
  });
  const autumnCategories = addCategories(em, autumn, false);
  const entries = addEntries(em, autumn, autumnCategories, AUTUMN_ENTRIES, people, true);
  // Every quilt but one has a photo (the one without shows how the ballot looks without).
  const files = new LocalDiskFileStore(appConfig() as AppConfig);
  for (const entry of [...springEntries.slice(1), ...entries]) {
    const photo = await quiltPhoto(entry.title, entry.widthMm / 25.4, entry.heightMm / 25.4);
    entry.photoKey = await files.put(photo.display);
    entry.photoThumbKey = await files.put(photo.thumb);
  }
  await em.flush();

  // 60 visitor cards (48 used) and 14 members voted; a fixed pattern, so the demo's results are stable.
  const byCategory = (name: string) => entries.filter((e) => e.category.name === name).map((e) => e.id);
  const large = byCategory('Large');
  const medium = byCategory('Medium');
  const small = byCategory('Small');
  const codes = Array.from({ length: 60 }, () => em.create(BallotCode, { show: autumn, code: generateBallotCode(), batch: 1 }));
  await em.flush();
  const members = [...people.values()].slice(6, 20);
  const voters = [...codes.slice(0, 48).map((c) => ({ key: `code:${c.id}`, channel: (c.id % 6 === 0 ? 'paper' : 'code') as 'code' | 'paper', code: c })), ...members.map((m) => ({ key: `member:${m.id}`, channel: 'member' as const, code: null }))];
  const pattern = [0, 1, 0, 2, 0, 1, 3, 0, 1, 2, 1, 0]; // Large: entry 0 most often, then 1
  voters.forEach((v, i) => {
    if (v.code) v.code.usedAt = closed.minus({ hours: (i % 20) + 1 }).toJSDate();
    em.create(ShowVoter, { show: autumn, voterKey: v.key, channel: v.channel, castAt: closed.minus({ hours: (i % 20) + 1 }).toJSDate() });
    const choices: Record<string, number[]> = { [autumnCategories.get('Large')!.id]: [large[pattern[i % pattern.length]]] };
    if (i % 5 !== 4) choices[autumnCategories.get('Medium')!.id] = [medium[(i * 7) % 3 === 0 ? 0 : i % 3]];
    if (i % 3 !== 2) choices[autumnCategories.get('Small')!.id] = [small[i % 4 === 0 ? 1 : 0]];
    em.create(ShowBallot, { id: randomBytes(16).toString('base64url'), show: autumn, choices: { categories: choices } });
  });
}
