import Alert from 'react-bootstrap/Alert';
import Card from 'react-bootstrap/Card';
import Col from 'react-bootstrap/Col';
import Row from 'react-bootstrap/Row';
import { Link, useParams, useSearchParams } from 'react-router-dom';
import { NotFound } from '@/components/errors/not-found';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { usePageTitle } from '@/components/ui/page-title';
import { paths } from '@/config/paths';
import { isDuesOfficer } from '@/config/roles';
import { useDuesPlans } from '@/features/dues/api/get-dues-plans';
import { useDuesSettings } from '@/features/dues/api/get-dues-settings';
import { hasCharge, useMyDues } from '@/features/dues/api/get-my-dues';
import { DuesStanding } from '@/features/dues/components/dues-standing';
import { PayDues } from '@/features/dues/components/pay-dues';
import { PaymentHistory } from '@/features/dues/components/payment-history';
import { useGuild } from '@/features/members/api/get-guild';
import { isApiError } from '@/lib/api-client';

export default function DuesRoute() {
  const { guildId = '' } = useParams();
  const [search, setSearch] = useSearchParams();
  const guild = useGuild(guildId);
  const settings = useDuesSettings(guildId);
  const dues = useMyDues(guildId);
  const plans = useDuesPlans(guildId);
  usePageTitle(guild.data ? `Dues, ${guild.data.name}` : 'Dues');
  const cancelled = search.get('cancelled') === '1';

  if (guild.isPending || dues.isPending) return <PageSpinner label="Looking up your dues" />;
  const failure = guild.error ?? dues.error;
  if (failure || !guild.data || !dues.data) {
    if (isApiError(failure) && failure.status === 404) return <NotFound />;
    return (
      <>
        <h1>Dues</h1>
        <ErrorAlert error={failure} />
      </>
    );
  }

  if (settings.data?.configured === false) {
    return (
      <>
        <div className="page-header">
          <h1>Dues</h1>
          <p className="lead mb-0">Your membership of {guild.data.name}</p>
        </div>
        <p className="fs-5">{guild.data.name} does not take dues through Selvage. Ask the guild’s treasurer how to pay.</p>
        {isDuesOfficer(guild.data.myRoles) && (
          <Link to={paths.treasurer.getHref(guildId, 'settings')} className="btn btn-primary">
            Set up dues and plans
          </Link>
        )}
      </>
    );
  }

  const me = dues.data;
  const currency = me.quote?.currency ?? guild.data.currency;
  const paysDues = me.status !== 'lifetime' && me.status !== 'honorary';
  const nothingDue = Boolean(me.quote && !hasCharge(me.quote));

  return (
    <>
      <div className="page-header">
        <h1>Dues</h1>
        <p className="lead mb-0">Your membership of {guild.data.name}</p>
      </div>

      {cancelled && (
        <Alert
          variant="info"
          dismissible
          closeLabel="Close this message"
          onClose={() => {
            const next = new URLSearchParams(search);
            next.delete('cancelled');
            setSearch(next, { replace: true });
          }}
          className="fs-5"
          data-testid="cancelled-note"
          role="status"
        >
          Payment cancelled. Nothing was charged. You can pay whenever you are ready.
        </Alert>
      )}

      <Row className="g-4 mb-4">
        <Col lg={paysDues ? 5 : 12}>
          <Card as="section" aria-labelledby="standing-heading">
            <Card.Body>
              <h2 id="standing-heading" className="h3 mb-3">
                Your membership
              </h2>
              <DuesStanding dues={me} />
            </Card.Body>
          </Card>
        </Col>
        {paysDues && (
          <Col lg={7}>
            <Card as="section" aria-labelledby="pay-heading" className="pay-card">
              <Card.Body>
                <h2 id="pay-heading" className="h3 mb-3">
                  {nothingDue ? 'Your next payment' : 'Pay your dues'}
                </h2>
                {me.openInvoice && !cancelled && !nothingDue && (
                  <Alert variant="light" className="border" data-testid="open-invoice-note">
                    You started a card payment earlier. If you finished it, it will show here in a moment. If not, nothing was charged and
                    you can pay now. <Link to={paths.duesReturn.getHref(guildId, me.openInvoice.id)}>Check that payment</Link>
                  </Alert>
                )}
                {plans.isPending && <PageSpinner label="Loading the plans" />}
                {plans.isError && <ErrorAlert error={plans.error} />}
                {plans.data && <PayDues guildId={guildId} dues={me} plans={plans.data} currency={currency} />}
              </Card.Body>
            </Card>
          </Col>
        )}
      </Row>

      <section aria-labelledby="history-heading" className="mb-4">
        <h2 id="history-heading" className="mb-3">
          Payments and receipts
        </h2>
        <PaymentHistory guildId={guildId} history={me.history} />
      </section>

      {isDuesOfficer(guild.data.myRoles) && (
        <p>
          <Link to={paths.treasurer.getHref(guildId)} className="tap-link">
            Treasurer pages: ledger, roster, reports and settings
          </Link>
        </p>
      )}
    </>
  );
}
