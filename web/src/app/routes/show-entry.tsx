import { useQuery } from '@tanstack/react-query';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { usePageTitle } from '@/components/ui/page-title';
import type { Guild } from '@/features/members/api/get-guild';
import { membersQueryOptions } from '@/features/members/api/get-members';
import { useEntries, useMyEntries } from '@/features/shows/api/get-entries';
import { useCreateEntry, useUpdateEntry } from '@/features/shows/api/save-entry';
import type { Entry, Show } from '@/features/shows/api/types';
import { EntryForm } from '@/features/shows/components/entry-form';
import { ShowGate } from '@/features/shows/components/show-gate';
import { SleeveNote } from '@/features/shows/components/sleeve-note';
import { showPaths } from '@/features/shows/lib/paths';
import { useUser } from '@/lib/auth';

function EntryPage({ guild, show, entryId }: { guild: Guild; show: Show; entryId?: string }) {
  const guildId = String(guild.id);
  const showId = String(show.id);
  const navigate = useNavigate();
  const editing = Boolean(entryId);
  const user = useUser();
  const mine = useMyEntries(guildId, showId, { enabled: editing });
  // There is no single-entry read: a chair may be changing someone else's entry, found in the full list.
  const all = useEntries(guildId, showId, '', { enabled: editing && show.canManage });
  const members = useQuery({ ...membersQueryOptions(guildId), enabled: show.canManage && !editing });
  const create = useCreateEntry(guildId, showId);
  const update = useUpdateEntry(guildId, showId);
  const title = editing ? 'Change an entry' : 'Enter a quilt';
  usePageTitle(`${title}, ${show.name}`);

  const header = (
    <div className="page-header">
      <h1>{title}</h1>
      <p className="lead mb-0">{show.name}</p>
    </div>
  );
  const back = (
    <Link to={showPaths.show.getHref(guildId, showId)} className="btn btn-primary">
      Back to the show
    </Link>
  );

  const waiting = user.isPending || (editing && (mine.isPending || (show.canManage && all.isPending))) || (show.canManage && !editing && members.isPending);
  if (waiting) return <PageSpinner label="Getting the form ready" />;

  const entry: Entry | undefined = editing
    ? (mine.data?.find((e) => String(e.id) === entryId) ?? all.data?.find((e) => String(e.id) === entryId))
    : undefined;
  const ownEntry = editing && mine.data?.some((e) => String(e.id) === entryId);

  if (editing && !entry) {
    return (
      <>
        {header}
        <ErrorAlert error={mine.error ?? all.error} />
        <p className="fs-5">We could not find that entry in this show.</p>
        {back}
      </>
    );
  }
  if (entry && entry.status !== 'submitted' && !show.canManage) {
    return (
      <>
        {header}
        <p className="fs-5">“{entry.title}” can no longer be changed here. Ask the show chair if something needs to change.</p>
        {back}
      </>
    );
  }
  if (!editing && show.entryWindow !== 'open' && !show.canManage) {
    return (
      <>
        {header}
        <p className="fs-5">{show.entryWindow === 'not_yet' ? 'Entries are not open yet.' : 'Entries are closed.'}</p>
        {back}
      </>
    );
  }
  if (show.categories.length === 0) {
    return (
      <>
        {header}
        <p className="fs-5">The show chair has not set up the categories yet, so quilts cannot be entered.</p>
        {back}
      </>
    );
  }

  const done = (saved: Entry) => {
    const notice = editing
      ? `“${saved.title}” is saved.`
      : `“${saved.title}” is entered. The show chair will look at it; you can add a photo below.`;
    if (editing && !ownEntry) navigate(showPaths.entriesReview.getHref(guildId, showId), { state: { notice } });
    else navigate(showPaths.show.getHref(guildId, showId), { state: { notice } });
  };

  return (
    <>
      {header}
      {!editing && <SleeveNote text={show.sleeve.text} headingId="entry-sleeve-heading" />}
      <ErrorAlert error={members.error} />
      <EntryForm
        guildId={guildId}
        show={show}
        entry={entry}
        makerName={user.data?.name ?? ''}
        members={show.canManage && !editing ? (members.data ?? []) : null}
        onCreate={(input) => create.mutateAsync(input)}
        onUpdate={(input) => update.mutateAsync({ entryId: entry!.id, input })}
        onSaved={done}
      />
    </>
  );
}

/** /enter for a new quilt, /entries/:entryId/edit to change one. */
export default function ShowEntryRoute() {
  const { guildId = '', showId = '', entryId } = useParams();
  return (
    <ShowGate guildId={guildId} showId={showId} title="Enter a quilt">
      {({ guild, show }) => <EntryPage guild={guild} show={show} entryId={entryId} />}
    </ShowGate>
  );
}
