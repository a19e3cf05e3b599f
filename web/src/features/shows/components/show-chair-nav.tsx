import { Link, useLocation } from 'react-router-dom';
import { showPaths } from '../lib/paths';

const SECTIONS = [
  { key: 'show', label: 'Show page', href: showPaths.show.getHref },
  { key: 'settings', label: 'Settings and categories', href: showPaths.settings.getHref },
  { key: 'entries-review', label: 'Entries', href: (g: string, s: string) => showPaths.entriesReview.getHref(g, s) },
  { key: 'voting', label: 'Ballot desk', href: showPaths.votingDesk.getHref },
  { key: 'results', label: 'Results', href: showPaths.results.getHref },
] as const;

/** Links between the show chair's pages; they wrap onto more lines on a phone. */
export function ShowChairNav({ guildId, showId }: { guildId: string; showId: string }) {
  const { pathname } = useLocation();
  const last = pathname.replace(/\/+$/, '').split('/').pop() ?? '';
  const active = SECTIONS.some((s) => s.key === last) ? last : 'show';
  return (
    <nav aria-label="Show chair pages" className="treasurer-nav show-chair-nav mb-4">
      <ul className="nav nav-pills">
        {SECTIONS.map((section) => (
          <li key={section.key} className="nav-item">
            <Link
              to={section.href(guildId, showId)}
              className={`nav-link${section.key === active ? ' active' : ''}`}
              aria-current={section.key === active ? 'page' : undefined}
            >
              {section.label}
            </Link>
          </li>
        ))}
      </ul>
    </nav>
  );
}
