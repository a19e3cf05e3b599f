import { useId, useState } from 'react';
import Alert from 'react-bootstrap/Alert';
import Button from 'react-bootstrap/Button';
import Form from 'react-bootstrap/Form';
import { Link, useLocation, useParams, useSearchParams } from 'react-router-dom';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { usePageTitle } from '@/components/ui/page-title';
import type { Guild } from '@/features/members/api/get-guild';
import { entriesCsvHref, entriesPdfHref, hangTagsHref } from '@/features/shows/api/downloads';
import { useNumberEntries, useReviewEntry } from '@/features/shows/api/entry-actions';
import { useEntries } from '@/features/shows/api/get-entries';
import { useUpdateEntry } from '@/features/shows/api/save-entry';
import type { Entry, EntryStatus, Show } from '@/features/shows/api/types';
import { ChangeEntryDialog, DeclineDialog } from '@/features/shows/components/entry-dialogs';
import { EntriesReviewTable } from '@/features/shows/components/entries-review-table';
import { ChairPageHeader, ShowGate } from '@/features/shows/components/show-gate';
import { ENTRY_STATUS_FILTERS } from '@/features/shows/lib/labels';
import { showPaths } from '@/features/shows/lib/paths';

const STATUSES = ENTRY_STATUS_FILTERS.map((f) => f.value) as readonly string[];

function ReviewPage({ guild, show }: { guild: Guild; show: Show }) {
  const guildId = String(guild.id);
  const showId = String(show.id);
  const id = useId();
  const location = useLocation();
  const [search, setSearch] = useSearchParams();
  const raw = search.get('status') ?? '';
  const status = (STATUSES.includes(raw) ? raw : '') as EntryStatus | '';
  const entries = useEntries(guildId, showId, status);
  const review = useReviewEntry(guildId, showId);
  const update = useUpdateEntry(guildId, showId);
  const numberAll = useNumberEntries(guildId, showId);
  const [declining, setDeclining] = useState<Entry | null>(null);
  const [changing, setChanging] = useState<Entry | null>(null);
  const [hideMakers, setHideMakers] = useState(show.makersHidden);
  const [announcement, setAnnouncement] = useState((location.state as { notice?: string } | null)?.notice ?? '');
  usePageTitle(`Entries, ${show.name}`);
  const ballotFixed = show.votingState === 'open' || show.votingState === 'closed';

  const accept = (entry: Entry) => {
    setAnnouncement('');
    review.mutate({ entryId: entry.id, input: { decision: 'accept' } }, { onSuccess: () => setAnnouncement(`“${entry.title}” is accepted.`) });
  };

  return (
    <>
      <ChairPageHeader guildId={guildId} show={show} title="Entries" />
      {ballotFixed ? (
        <Alert variant="info" className="text-body">
          Voting has opened, so the quilts on the ballot, their categories and their numbers stay as they are. You can still correct a title or
          other details.
        </Alert>
      ) : (
        <>
          <div className="d-flex flex-wrap gap-2 mb-3">
            <Link to={showPaths.enter.getHref(guildId, showId)} className="btn btn-outline-primary">
              Enter a quilt for a member
            </Link>
            <Button
              variant="outline-primary"
              disabled={numberAll.isPending}
              onClick={() => {
                setAnnouncement('');
                numberAll.mutate(undefined, {
                  onSuccess: (numbered) =>
                    setAnnouncement(
                      numbered.length
                        ? `Numbered ${numbered.length} accepted ${numbered.length === 1 ? 'entry' : 'entries'}.`
                        : 'Every accepted entry already has a number.',
                    ),
                });
              }}
            >
              {numberAll.isPending ? 'Numbering…' : 'Number all accepted entries'}
            </Button>
          </div>
          <p className="form-text">Numbers go to accepted entries that have none yet, category by category. Numbers already given stay.</p>
        </>
      )}

      <section aria-labelledby="downloads-heading" className="downloads mb-4">
        <h2 id="downloads-heading" className="h4">
          Print and download
        </h2>
        <Form.Check id={`${id}-hide`} className="mb-1">
          <Form.Check.Input type="checkbox" checked={hideMakers} onChange={(e) => setHideMakers(e.currentTarget.checked)} />
          <Form.Check.Label>Hide makers’ names on the hang tags</Form.Check.Label>
        </Form.Check>
        <ul className="plain-list d-flex flex-wrap column-gap-4">
          <li>
            <a href={hangTagsHref(guildId, showId, hideMakers)} className="tap-link" download>
              Hang tags (PDF)
            </a>
          </li>
          <li>
            <a href={entriesPdfHref(guildId, showId)} className="tap-link" download>
              Entry list (PDF)
            </a>
          </li>
          <li>
            <a href={entriesCsvHref(guildId, showId)} className="tap-link" download>
              Entry list (CSV)
            </a>
          </li>
        </ul>
      </section>

      <section aria-labelledby="list-heading">
        <h2 id="list-heading" className="h4">
          The entries
        </h2>
        <Form.Group controlId={`${id}-status`} className="mb-3 entries-filter">
          <Form.Label>Show</Form.Label>
          <Form.Select
            value={status}
            onChange={(e) => {
              setAnnouncement('');
              const next = e.currentTarget.value;
              setSearch(next ? new URLSearchParams({ status: next }) : new URLSearchParams());
            }}
          >
            <option value="">All entries</option>
            {ENTRY_STATUS_FILTERS.map((f) => (
              <option key={f.value} value={f.value}>
                {f.label}
              </option>
            ))}
          </Form.Select>
        </Form.Group>
        <p role="status" className={announcement ? 'alert alert-success' : 'visually-hidden'}>
          {announcement || (entries.data && !entries.isFetching ? `${entries.data.length} entries shown.` : '')}
        </p>
        <ErrorAlert error={review.error ?? numberAll.error} />
        {entries.isPending && <PageSpinner label="Loading the entries" />}
        {entries.isError && <ErrorAlert error={entries.error} />}
        {entries.data && (
          <div className={entries.isPlaceholderData ? 'opacity-50' : undefined} aria-busy={entries.isPlaceholderData || undefined}>
            <EntriesReviewTable
              guildId={guildId}
              showId={showId}
              entries={entries.data}
              currency={show.currency}
              busy={review.isPending}
              ballotFixed={ballotFixed}
              onAccept={accept}
              onDecline={(entry) => {
                setAnnouncement('');
                setDeclining(entry);
              }}
              onChange={(entry) => {
                setAnnouncement('');
                setChanging(entry);
              }}
            />
          </div>
        )}
      </section>
      {show.categories.length === 0 && (
        <Alert variant="warning" className="text-body">
          This show has no categories yet.
        </Alert>
      )}
      <DeclineDialog
        entry={declining}
        onHide={() => setDeclining(null)}
        onDecline={(entry, reason) =>
          review.mutateAsync({ entryId: entry.id, input: { decision: 'decline', reason } }).then(() => setAnnouncement(`“${entry.title}” is declined.`))
        }
      />
      <ChangeEntryDialog
        entry={changing}
        categories={show.categories}
        onHide={() => setChanging(null)}
        onSave={(entry, input) => update.mutateAsync({ entryId: entry.id, input }).then(() => setAnnouncement(`“${entry.title}” is saved.`))}
      />
    </>
  );
}

export default function ShowEntriesReviewRoute() {
  const { guildId = '', showId = '' } = useParams();
  return (
    <ShowGate guildId={guildId} showId={showId} title="Entries" chairOnly>
      {({ guild, show }) => <ReviewPage guild={guild} show={show} />}
    </ShowGate>
  );
}
