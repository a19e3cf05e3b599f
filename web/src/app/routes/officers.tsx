import { useState } from 'react';
import Card from 'react-bootstrap/Card';
import Col from 'react-bootstrap/Col';
import Row from 'react-bootstrap/Row';
import { Link, useParams } from 'react-router-dom';
import { NotFound } from '@/components/errors/not-found';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { usePageTitle } from '@/components/ui/page-title';
import { paths } from '@/config/paths';
import { useGuild } from '@/features/members/api/get-guild';
import { useMembers } from '@/features/members/api/get-members';
import { useOfficeHistory } from '@/features/offices/api/get-office-history';
import { useOffices, type Term } from '@/features/offices/api/get-offices';
import { useHandOver } from '@/features/offices/api/hand-over';
import { useUpdateTerm } from '@/features/offices/api/update-term';
import { HandoverForm } from '@/features/offices/components/handover-form';
import { OfficeHistory } from '@/features/offices/components/office-history';
import { OfficeList } from '@/features/offices/components/office-list';
import { TermDatesModal } from '@/features/offices/components/term-dates-modal';
import { isApiError } from '@/lib/api-client';

export default function OfficersRoute() {
  const { guildId = '' } = useParams();
  const guild = useGuild(guildId);
  const offices = useOffices(guildId);
  const history = useOfficeHistory(guildId);
  const isAdmin = Boolean(guild.data?.myRoles?.includes('admin'));
  const members = useMembers(guildId);
  const handOver = useHandOver(guildId);
  const updateTerm = useUpdateTerm(guildId);
  const [editing, setEditing] = useState<Term | null>(null);
  usePageTitle(guild.data ? `${guild.data.name} officers` : 'Officers');

  if (guild.isPending) return <PageSpinner label="Loading the guild" />;
  if (guild.isError) {
    if (isApiError(guild.error) && guild.error.status === 404) return <NotFound />;
    return (
      <>
        <h1>Officers</h1>
        <ErrorAlert error={guild.error} />
      </>
    );
  }

  const today = offices.data?.today ?? '';
  const active = (members.data ?? []).filter((m) => !m.status || m.status === 'active');

  return (
    <>
      <div className="page-header">
        <h1>{guild.data.name} officers</h1>
        <p className="lead mb-0">Who looks after what, and until when.</p>
        <Link to={paths.members.getHref(guildId)} className="btn btn-outline-primary mt-3">
          Back to the member directory
        </Link>
      </div>
      <Row className="g-4">
        <Col lg={isAdmin ? 7 : 12}>
          <section aria-labelledby="offices-heading" className="mb-4">
            <h2 id="offices-heading" className="mb-3">
              Offices today
            </h2>
            {offices.isPending && <PageSpinner label="Loading the offices" />}
            {offices.isError && <ErrorAlert error={offices.error} />}
            {offices.data && <OfficeList offices={offices.data.offices} today={today} canEdit={isAdmin} onEditTerm={setEditing} />}
          </section>
          <section aria-labelledby="history-heading">
            <h2 id="history-heading" className="mb-3">
              History
            </h2>
            {history.isPending && <PageSpinner label="Loading the history" />}
            {history.isError && <ErrorAlert error={history.error} />}
            {history.data && <OfficeHistory terms={history.data.terms} today={history.data.today} />}
          </section>
        </Col>
        {isAdmin && offices.data && (
          <Col lg={5}>
            <Card as="section" aria-labelledby="handover-heading">
              <Card.Body>
                <h2 id="handover-heading" className="h3 mb-3">
                  Hand over an office
                </h2>
                <HandoverForm offices={offices.data.offices} members={active} today={today} onSubmit={(input) => handOver.mutateAsync(input)} />
              </Card.Body>
            </Card>
          </Col>
        )}
      </Row>
      {isAdmin && (
        <TermDatesModal term={editing} onHide={() => setEditing(null)} onSave={(term, input) => updateTerm.mutateAsync({ termId: term.id, ...input })} />
      )}
    </>
  );
}
