import Card from 'react-bootstrap/Card';
import Col from 'react-bootstrap/Col';
import Row from 'react-bootstrap/Row';
import { useNavigate, useParams } from 'react-router-dom';
import { NotFound } from '@/components/errors/not-found';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { usePageTitle } from '@/components/ui/page-title';
import { paths } from '@/config/paths';
import { useBees } from '@/features/bees/api/get-bees';
import { BeeList } from '@/features/bees/components/bee-list';
import { StartBeeForm } from '@/features/bees/components/start-bee-form';
import { useGuild } from '@/features/members/api/get-guild';
import { isApiError } from '@/lib/api-client';
import { currentMonth } from '@/lib/dates';

export default function BeesRoute() {
  const { guildId = '' } = useParams();
  const navigate = useNavigate();
  const guild = useGuild(guildId);
  const bees = useBees(guildId);
  usePageTitle(guild.data ? `${guild.data.name} bees` : 'Bees');

  if (guild.isPending) return <PageSpinner label="Loading the guild" />;
  if (guild.isError) {
    if (isApiError(guild.error) && guild.error.status === 404) return <NotFound />;
    return (
      <>
        <h1>Bees</h1>
        <ErrorAlert error={guild.error} />
      </>
    );
  }

  const count = bees.data?.length;
  return (
    <>
      <div className="page-header">
        <h1>{guild.data.name} bees</h1>
        <p className="lead mb-0">
          In a bee, each month one maker is the queen and the others make her a block.
        </p>
        <a href="#start-bee" className="btn btn-outline-primary mt-3">
          Jump to “Start a bee”
        </a>
      </div>
      <Row className="g-4">
        <Col lg={7}>
          <section aria-labelledby="bees-heading">
            <h2 id="bees-heading" className="mb-3">
              Bees{count !== undefined && <span className="text-body-secondary fw-normal"> ({count})</span>}
            </h2>
            {bees.isPending && <PageSpinner label="Loading the bees" />}
            {bees.isError && <ErrorAlert error={bees.error} />}
            {bees.data && <BeeList guildId={guildId} bees={bees.data} />}
          </section>
        </Col>
        <Col lg={5}>
          <Card as="section" id="start-bee" tabIndex={-1} aria-labelledby="start-bee-heading">
            <Card.Body>
              <h2 id="start-bee-heading" className="h3 mb-3">
                Start a bee
              </h2>
              <StartBeeForm
                guildId={guildId}
                thisMonth={currentMonth(guild.data.timeZone)}
                onCreated={(bee) => navigate(paths.bee.getHref(guildId, bee.id))}
              />
            </Card.Body>
          </Card>
        </Col>
      </Row>
    </>
  );
}
