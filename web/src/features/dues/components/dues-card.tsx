import Card from 'react-bootstrap/Card';
import { Link } from 'react-router-dom';
import { isApiError } from '@/lib/api-client';
import { useDuesSettings } from '../api/get-dues-settings';
import { hasCharge, useMyDues } from '../api/get-my-dues';
import { formatMoney } from '../lib/money';
import { neverPaid, standingSentence } from './dues-standing';
import { DuesStatusBadge } from './status-badge';

type DuesCardProps = {
  guildId: string;
  guildName: string;
  /** The dues page of this guild. */
  href: string;
  /** Name the guild in the heading (she belongs to more than one). */
  showGuildName?: boolean;
};

const dues404 = (error: unknown) => isApiError(error) && (error.status === 404 || error.status === 403);

/** A small card for the dashboard: her dues status in one guild and a way to the dues page. */
export function DuesCard({ guildId, guildName, href, showGuildName = false }: DuesCardProps) {
  const settings = useDuesSettings(guildId);
  const notSetUp = settings.data?.configured === false || dues404(settings.error);
  const dues = useMyDues(guildId, { enabled: settings.isSuccess && !notSetUp });
  const headingId = `dues-card-${guildId}`;
  const quote = dues.data?.quote;
  const owes = Boolean(quote && hasCharge(quote));
  const behind = dues.data?.status === 'grace' || dues.data?.status === 'lapsed';
  return (
    <Card as="article" aria-labelledby={headingId} className="h-100" data-testid="dues-card">
      <Card.Body className="d-flex flex-column">
        <h3 id={headingId} className="h4 mb-2">
          {showGuildName ? `Dues: ${guildName}` : 'My dues'}
        </h3>
        {(settings.isPending || (dues.isPending && !notSetUp && !settings.isError)) && (
          <p className="text-body-secondary">Looking up your dues…</p>
        )}
        {notSetUp && <p className="text-body-secondary">This guild does not take dues through Selvage.</p>}
        {(dues.isError || (settings.isError && !notSetUp)) && <p>We could not look up your dues just now.</p>}
        {dues.data && (
          <>
            <p className="mb-2">
              <span className="visually-hidden">Status: </span>
              <DuesStatusBadge status={dues.data.status} neverPaid={neverPaid(dues.data)} />
            </p>
            <p className="mb-3">
              {standingSentence(dues.data, false)}
              {owes && quote && (behind ? <> You owe {formatMoney(quote.totalCents, quote.currency)}.</> : <> You can renew now: {formatMoney(quote.totalCents, quote.currency)}.</>)}
            </p>
          </>
        )}
        {!notSetUp && (
          <Link to={href} className={`btn ${owes ? 'btn-primary' : 'btn-outline-primary'} mt-auto align-self-start`}>
            {owes ? 'Pay my dues' : 'My dues and receipts'}
            <span className="visually-hidden"> for {guildName}</span>
          </Link>
        )}
      </Card.Body>
    </Card>
  );
}
