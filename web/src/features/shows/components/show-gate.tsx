import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { NotFound } from '@/components/errors/not-found';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { useGuild, type Guild } from '@/features/members/api/get-guild';
import { isApiError } from '@/lib/api-client';
import { useShow } from '../api/get-show';
import type { Show } from '../api/types';
import { showPaths } from '../lib/paths';
import { ShowChairNav } from './show-chair-nav';

type ShowGateProps = {
  guildId: string;
  showId: string;
  /** The page's name, for the heading while it loads or fails. */
  title: string;
  /** Pages for the show chair and admins only. */
  chairOnly?: boolean;
  children: (loaded: { guild: Guild; show: Show }) => ReactNode;
};

/** Loads the guild and the show for a show page, and says plainly when it cannot. */
export function ShowGate({ guildId, showId, title, chairOnly = false, children }: ShowGateProps) {
  const guild = useGuild(guildId);
  const show = useShow(guildId, showId);

  if (guild.isPending || show.isPending) return <PageSpinner label="Loading the show" />;
  const failure = guild.error ?? show.error;
  if (failure || !guild.data || !show.data) {
    if (isApiError(failure) && failure.status === 404) return <NotFound />;
    return (
      <>
        <h1>{title}</h1>
        <ErrorAlert error={failure} />
      </>
    );
  }
  if (chairOnly && !show.data.canManage) {
    return (
      <>
        <h1>{title}</h1>
        <p className="fs-5">This page is for the show chair and the guild’s admins.</p>
        <Link to={showPaths.show.getHref(guildId, showId)} className="btn btn-primary">
          Go to the show
        </Link>
      </>
    );
  }
  return <>{children({ guild: guild.data, show: show.data })}</>;
}

/** The heading of a show chair's page, with the links between those pages. */
export function ChairPageHeader({ guildId, show, title }: { guildId: string; show: Show; title: string }) {
  return (
    <>
      <div className="page-header mb-3">
        <h1>{title}</h1>
        <p className="lead mb-0">{show.name}</p>
      </div>
      <ShowChairNav guildId={guildId} showId={String(show.id)} />
    </>
  );
}
