import Card from 'react-bootstrap/Card';
import Col from 'react-bootstrap/Col';
import Row from 'react-bootstrap/Row';
import { Link } from 'react-router-dom';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { usePageTitle } from '@/components/ui/page-title';
import { paths } from '@/config/paths';
import { useDashboard } from '@/features/dashboard/api/get-dashboard';
import { GuildCard } from '@/features/dashboard/components/guild-card';
import { OwedBlocks } from '@/features/dashboard/components/owed-blocks';
import { DuesCard } from '@/features/dues/components/dues-card';
import { useUser } from '@/lib/auth';

export default function DashboardRoute() {
  usePageTitle('Dashboard');
  const { data: user } = useUser();
  const dashboard = useDashboard();
  const name = dashboard.data?.user.name ?? user?.name ?? '';
  const firstName = name.split(/\s+/)[0];

  return (
    <>
      <div className="page-header">
        <h1>{firstName ? `Hello, ${firstName}` : 'Hello'}</h1>
        <p className="lead mb-0">Here is what is happening in your guilds.</p>
      </div>

      <section aria-labelledby="my-guilds" className="mb-5">
        <h2 id="my-guilds" className="mb-3">
          My guilds
        </h2>
        {dashboard.isPending && <PageSpinner label="Loading your guilds" />}
        {dashboard.isError && <ErrorAlert error={dashboard.error} />}
        {dashboard.data && dashboard.data.guilds.length === 0 && (
          <p>You are not a member of any guild yet. When a guild officer invites you, the e-mail will bring you here; or start a guild of your own below.</p>
        )}
        {dashboard.data && dashboard.data.guilds.length > 0 && (
          <Row xs={1} md={2} xl={3} className="g-3">
            {dashboard.data.guilds.map((guild) => (
              <Col key={guild.id}>
                <GuildCard guild={guild} />
              </Col>
            ))}
          </Row>
        )}
      </section>

      {dashboard.data && dashboard.data.guilds.length > 0 && (
        <section aria-labelledby="dues-heading" className="mb-5">
          <h2 id="dues-heading" className="mb-3">
            Dues
          </h2>
          <Row xs={1} md={2} xl={3} className="g-3">
            {dashboard.data.guilds.map((guild) => (
              <Col key={guild.id}>
                <DuesCard
                  guildId={String(guild.id)}
                  guildName={guild.name}
                  href={paths.dues.getHref(guild.id)}
                  showGuildName={dashboard.data.guilds.length > 1}
                />
              </Col>
            ))}
          </Row>
        </section>
      )}

      <section aria-labelledby="owed-heading" className="mb-5">
        <h2 id="owed-heading" className="mb-3">
          Blocks I owe
        </h2>
        {dashboard.isPending && <PageSpinner label="Loading your blocks" />}
        {dashboard.data && <OwedBlocks owed={dashboard.data.owed ?? []} />}
      </section>

      <section aria-labelledby="new-guild-heading" className="mb-3">
        <h2 id="new-guild-heading" className="mb-3">
          Start a guild
        </h2>
        <Card className="h-100">
          <Card.Body>
            <p>Running a guild that is not on Selvage yet? Start it here and invite its members; you will be its admin.</p>
            <Link to={paths.newGuild.getHref()} className="btn btn-outline-primary">
              Start a new guild
            </Link>
          </Card.Body>
        </Card>
      </section>
    </>
  );
}
