import { Link, Outlet, useParams } from 'react-router-dom';
import { NotFound } from '@/components/errors/not-found';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { usePageTitle } from '@/components/ui/page-title';
import { paths } from '@/config/paths';
import { isDuesOfficer } from '@/config/roles';
import { TreasurerNav } from '@/features/dues/components/treasurer-nav';
import { useGuild } from '@/features/members/api/get-guild';
import { isApiError } from '@/lib/api-client';

/** The treasurer's pages share a heading and their links; each page is its own route below. */
export default function TreasurerRoute() {
  const { guildId = '' } = useParams();
  const guild = useGuild(guildId);
  usePageTitle(guild.data ? `Treasurer, ${guild.data.name}` : 'Treasurer');

  if (guild.isPending) return <PageSpinner label="Loading the guild" />;
  if (guild.isError) {
    if (isApiError(guild.error) && guild.error.status === 404) return <NotFound />;
    return (
      <>
        <h1>Treasurer</h1>
        <ErrorAlert error={guild.error} />
      </>
    );
  }
  if (!isDuesOfficer(guild.data.myRoles)) {
    return (
      <>
        <h1>Treasurer</h1>
        <p className="fs-5">These pages are for the guild’s treasurer and admins.</p>
        <Link to={paths.dues.getHref(guildId)} className="btn btn-primary">
          Go to my dues
        </Link>
      </>
    );
  }
  return (
    <>
      <div className="page-header mb-3">
        <h1>Treasurer</h1>
        <p className="lead mb-0">Dues for {guild.data.name}</p>
      </div>
      <TreasurerNav guildId={guildId} />
      <Outlet />
    </>
  );
}
