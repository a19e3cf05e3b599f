import { Link, useLocation } from 'react-router-dom';
import { paths, TREASURER_SECTIONS, type TreasurerSection } from '@/config/paths';

export const SECTION_LABELS: Record<TreasurerSection, string> = {
  ledger: 'Ledger',
  roster: 'Roster',
  record: 'Record a payment',
  report: 'Report',
  settings: 'Settings and plans',
  audit: 'Audit log',
};

/** The section in the address, the ledger when there is none. */
export function currentSection(pathname: string): TreasurerSection {
  const last = pathname.replace(/\/+$/, '').split('/').pop() ?? '';
  return (TREASURER_SECTIONS as readonly string[]).includes(last) ? (last as TreasurerSection) : 'ledger';
}

/** Links between the treasurer's pages; they wrap onto more lines on a phone. */
export function TreasurerNav({ guildId }: { guildId: string }) {
  const { pathname } = useLocation();
  const active = currentSection(pathname);
  return (
    <nav aria-label="Treasurer pages" className="treasurer-nav mb-4">
      <ul className="nav nav-pills">
        {TREASURER_SECTIONS.map((section) => (
          <li key={section} className="nav-item">
            <Link
              to={paths.treasurer.getHref(guildId, section)}
              className={`nav-link${section === active ? ' active' : ''}`}
              aria-current={section === active ? 'page' : undefined}
            >
              {SECTION_LABELS[section]}
            </Link>
          </li>
        ))}
      </ul>
    </nav>
  );
}
