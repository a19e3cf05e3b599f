import type { EntityManager } from '@mikro-orm/core';
import { DateTime } from 'luxon';
import { todayIn } from '../../dues/dues-rules';
import type { Guild } from '../../guilds/guild.entity';
import type { Membership } from '../../guilds/membership.entity';
import type { Role } from '../../guilds/roles';
import { OfficeTerm } from '../../offices/office-term.entity';

/**
 * Every demo officer's term, so the Officers page has a story: in Wrenfield the treasurer's office
 * changed hands on the last 1 January (Clementine Marchbanks to Doreen Achterberg), and Priya
 * Castellano's term as show chair ends in a few months, when Edith Vasquez-Orr takes over.
 * Everyone keeps the roles the demo file gives her today.
 */
export async function seedDemoOffices(em: EntityManager, guild: Guild, memberships: Map<string, Membership>, wrenfield: boolean): Promise<void> {
  const today = DateTime.fromISO(todayIn(guild.timeZone), { zone: guild.timeZone });
  const newYear = today.startOf('year').toISODate()!;
  const showHandover = today.plus({ months: 4 }).startOf('month').toISODate()!;
  const joined = (m: Membership) => todayIn(guild.timeZone, m.joinedAt);
  const term = (email: string, role: Role, startsOn: string, endsOn: string | null, note = '', recordedBy: Membership | null = null) => {
    const membership = memberships.get(email);
    if (membership) em.create(OfficeTerm, { guild, membership, role, startsOn, endsOn, note, recordedBy });
  };
  const admin = wrenfield ? memberships.get('hazel@wrenfield.example') ?? null : null;
  for (const [email, m] of memberships) {
    for (const role of m.roles) {
      if (wrenfield && email === 'doreen@wrenfield.example' && role === 'treasurer') continue;
      if (wrenfield && email === 'priya@wrenfield.example' && role === 'show_chair') continue;
      term(email, role, joined(m), null);
    }
  }
  if (wrenfield) {
    const clementine = memberships.get('clementine@wrenfield.example');
    const from = clementine ? joined(clementine) : newYear;
    term('clementine@wrenfield.example', 'treasurer', from < newYear ? from : today.minus({ years: 1 }).startOf('year').toISODate()!, newYear, 'Stepped down after two years of books', admin);
    term('doreen@wrenfield.example', 'treasurer', newYear, null, 'Elected at the December meeting', admin);
    const priya = memberships.get('priya@wrenfield.example');
    term('priya@wrenfield.example', 'show_chair', priya ? joined(priya) : newYear, showHandover, 'Chairs the shows until the spring handover', admin);
    term('edith@wrenfield.example', 'show_chair', showHandover, null, 'Takes over the shows', admin);
  }
  await em.flush();
}
