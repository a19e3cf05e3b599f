import { Link, useParams } from 'react-router-dom';
import { NotFound } from '@/components/errors/not-found';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { usePageTitle } from '@/components/ui/page-title';
import { useGuild } from '@/features/members/api/get-guild';
import { useShows } from '@/features/shows/api/get-shows';
import { ShowList } from '@/features/shows/components/show-list';
import { showPaths } from '@/features/shows/lib/paths';
import { isShowChair } from '@/features/shows/lib/roles';
import { isApiError } from '@/lib/api-client';

export default function ShowListRoute() {
  const { guildId = '' } = useParams();
  const guild = useGuild(guildId);
  const shows = useShows(guildId);
  usePageTitle(guild.data ? `${guild.data.name} shows` : 'Shows');

  if (guild.isPending) return <PageSpinner label="Loading the guild" />;
  if (guild.isError) {
    if (isApiError(guild.error) && guild.error.status === 404) return <NotFound />;
    return (
      <>
        <h1>Quilt shows</h1>
        <ErrorAlert error={guild.error} />
      </>
    );
  }

  return (
    <>
      <div className="page-header">
        <h1>Quilt shows</h1>
        <p className="lead mb-0">{guild.data.name}</p>
        {isShowChair(guild.data.myRoles) && (
          <Link to={showPaths.create.getHref(guildId)} className="btn btn-primary mt-3">
            New show
          </Link>
        )}
      </div>
      {shows.isPending && <PageSpinner label="Loading the shows" />}
      {shows.isError && <ErrorAlert error={shows.error} />}
      {shows.data && <ShowList guildId={guildId} shows={shows.data} />}
    </>
  );
}
