import Button from 'react-bootstrap/Button';
import { useParams, useSearchParams } from 'react-router-dom';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { usePageTitle } from '@/components/ui/page-title';
import { paths } from '@/config/paths';
import { BEHIND_STATUSES, rosterCsvHref, useRoster } from '@/features/dues/api/get-roster';
import { RosterTable } from '@/features/dues/components/roster-table';

export default function TreasurerRosterRoute() {
  const { guildId = '' } = useParams();
  const [search, setSearch] = useSearchParams();
  const behindOnly = search.get('show') === 'owing';
  const statuses = behindOnly ? BEHIND_STATUSES : [];
  const roster = useRoster(guildId, statuses);
  usePageTitle('Roster');
  const count = roster.data?.length;

  return (
    <section aria-labelledby="roster-heading">
      <div className="d-flex flex-wrap justify-content-between align-items-center gap-2 mb-3">
        <h2 id="roster-heading" className="mb-0">
          Roster
        </h2>
        <a href={rosterCsvHref(guildId, statuses)} className="btn btn-outline-primary" download>
          Download this list (CSV)
        </a>
      </div>
      <div role="group" aria-label="Who to show" className="d-flex flex-wrap gap-2 mb-3">
        <Button variant={behindOnly ? 'outline-primary' : 'primary'} aria-pressed={!behindOnly} onClick={() => setSearch({})}>
          Everyone
        </Button>
        <Button variant={behindOnly ? 'primary' : 'outline-primary'} aria-pressed={behindOnly} onClick={() => setSearch({ show: 'owing' })}>
          Only “due now” or “overdue”
        </Button>
      </div>
      <p role="status">
        {count === undefined ? '' : behindOnly ? `${count} ${count === 1 ? 'member owes' : 'members owe'} dues.` : `${count} members.`}
      </p>
      {roster.isPending && <PageSpinner label="Loading the roster" />}
      {roster.isError && <ErrorAlert error={roster.error} />}
      {roster.data && (
        <div className={roster.isPlaceholderData ? 'opacity-50' : undefined}>
          <RosterTable
            rows={roster.data}
            recordHref={(membershipId) => paths.treasurer.getHref(guildId, 'record', `?member=${encodeURIComponent(String(membershipId))}`)}
          />
        </div>
      )}
    </section>
  );
}
