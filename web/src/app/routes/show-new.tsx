import Card from 'react-bootstrap/Card';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { NotFound } from '@/components/errors/not-found';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { usePageTitle } from '@/components/ui/page-title';
import { useGuild } from '@/features/members/api/get-guild';
import { useCreateShow } from '@/features/shows/api/create-show';
import { ShowForm } from '@/features/shows/components/show-form';
import { showPaths } from '@/features/shows/lib/paths';
import { isShowChair } from '@/features/shows/lib/roles';
import { isApiError } from '@/lib/api-client';

export default function ShowNewRoute() {
  const { guildId = '' } = useParams();
  const navigate = useNavigate();
  const guild = useGuild(guildId);
  const create = useCreateShow(guildId);
  usePageTitle('New show');

  if (guild.isPending) return <PageSpinner label="Loading the guild" />;
  if (guild.isError) {
    if (isApiError(guild.error) && guild.error.status === 404) return <NotFound />;
    return (
      <>
        <h1>New show</h1>
        <ErrorAlert error={guild.error} />
      </>
    );
  }
  if (!isShowChair(guild.data.myRoles)) {
    return (
      <>
        <h1>New show</h1>
        <p className="fs-5">Only the show chair and the guild’s admins can set up a show.</p>
        <Link to={showPaths.list.getHref(guildId)} className="btn btn-primary">
          See the shows
        </Link>
      </>
    );
  }
  return (
    <>
      <div className="page-header">
        <h1>New show</h1>
        <p className="lead mb-0">{guild.data.name}</p>
      </div>
      <p>After this you add the categories, and can set when voting opens and closes.</p>
      <Card className="narrow-card">
        <Card.Body>
          <ShowForm
            currency={guild.data.currency}
            timeZone={guild.data.timeZone}
            onSave={(input) => create.mutateAsync(input)}
            onSaved={(show) =>
              navigate(showPaths.settings.getHref(guildId, show.id), {
                state: { notice: `${show.name} is created. Now add its categories.` },
              })
            }
          />
        </Card.Body>
      </Card>
    </>
  );
}
