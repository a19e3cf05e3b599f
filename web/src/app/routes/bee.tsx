import { useState } from 'react';
import Badge from 'react-bootstrap/Badge';
import Button from 'react-bootstrap/Button';
import Card from 'react-bootstrap/Card';
import Col from 'react-bootstrap/Col';
import Row from 'react-bootstrap/Row';
import { Link, useParams } from 'react-router-dom';
import { NotFound } from '@/components/errors/not-found';
import { ConfirmAction } from '@/components/ui/confirm-action';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { usePageTitle } from '@/components/ui/page-title';
import { paths } from '@/config/paths';
import { dashboardQueryOptions } from '@/features/dashboard/api/get-dashboard';
import { beeQueryOptions, beeSchedulePdfHref, useBee, type Bee } from '@/features/bees/api/get-bee';
import { useJoinBee } from '@/features/bees/api/join-bee';
import { useLeaveBee } from '@/features/bees/api/leave-bee';
import { AddPaperMakersForm } from '@/features/bees/components/add-paper-makers-form';
import { BeeMembers } from '@/features/bees/components/bee-members';
import { InviteMakersForm } from '@/features/bees/components/invite-makers-form';
import { handoverLabel, myStatusLabel } from '@/features/bees/components/labels';
import { RotationTable } from '@/features/bees/components/rotation-table';
import { ManualOrder, ShuffleRotation, SwapMonths } from '@/features/bees/components/rotation-tools';
import { useGuild } from '@/features/members/api/get-guild';
import { useMembers } from '@/features/members/api/get-members';
import { isApiError } from '@/lib/api-client';
import { currentMonth, formatMonth, lastMonth } from '@/lib/dates';

function MyPlace({ guildId, bee }: { guildId: string; bee: Bee }) {
  const beeId = String(bee.id);
  const also = [beeQueryOptions(guildId, beeId).queryKey, dashboardQueryOptions().queryKey];
  const join = useJoinBee(guildId, beeId, also);
  const leave = useLeaveBee(guildId, beeId, also);
  const [message, setMessage] = useState('');

  return (
    <div className="my-place">
      <p className="mb-2">
        <Badge bg={bee.myStatus ? 'primary' : 'light'} text={bee.myStatus ? undefined : 'dark'} className="status-badge border">
          {myStatusLabel(bee.isOrganiser ? 'organiser' : bee.myStatus)}
        </Badge>
      </p>
      <ErrorAlert error={join.error ?? leave.error} />
      <p role="status" aria-live="polite" className={message ? 'alert alert-success' : 'visually-hidden'}>
        {message}
      </p>
      {bee.myStatus === 'invited' && (
        <>
          <p>{bee.organiser.name} invited you. Join to take a turn as queen and make blocks for the others.</p>
          <Button
            variant="primary"
            disabled={join.isPending}
            onClick={() => join.mutate(undefined, { onSuccess: () => setMessage(`Welcome to ${bee.name}! Your months are in the table below.`) })}
          >
            Join this bee
          </Button>
        </>
      )}
      {bee.myStatus === 'active' && !bee.isOrganiser && (
        <ConfirmAction
          label="Leave this bee"
          question={`Leave ${bee.name}? You stop making blocks from next month, and your months ahead go to the other makers. Past months stay as they were.`}
          confirmLabel="Yes, leave the bee"
          cancelLabel="Stay in the bee"
          busy={leave.isPending}
          onConfirm={async () => {
            await leave.mutateAsync();
            setMessage(`You have left ${bee.name}.`);
          }}
        />
      )}
    </div>
  );
}

export default function BeeRoute() {
  const { guildId = '', beeId = '' } = useParams();
  const guild = useGuild(guildId);
  const bee = useBee(guildId, beeId);
  const members = useMembers(guildId);
  const [orderSaved, setOrderSaved] = useState('');
  usePageTitle(bee.data?.name ?? 'Bee');

  if (bee.isPending || guild.isPending) return <PageSpinner label="Loading the bee" />;
  const failure = bee.error ?? guild.error;
  if (failure || !bee.data || !guild.data) {
    if (isApiError(failure) && failure.status === 404) return <NotFound />;
    return (
      <>
        <h1>Bee</h1>
        <ErrorAlert error={failure} />
      </>
    );
  }

  const data = bee.data;
  const thisMonth = data.currentMonth ?? currentMonth(guild.data.timeZone);
  const inBee = new Set(data.members.filter((m) => m.status !== 'left').map((m) => String(m.membershipId)));
  inBee.add(String(data.organiser.membershipId));
  // Members who do not sign in are added by the organiser (below), never invited.
  const onPaper = new Set((data.addable ?? []).map((m) => String(m.membershipId)));
  const candidates = (members.data ?? []).filter((m) => !inBee.has(String(m.membershipId)) && !onPaper.has(String(m.membershipId)));
  const rotationKey = `${data.seed ?? ''}|${data.members.map((m) => `${m.membershipId}:${m.status}`).join(',')}|${data.rotation
    .map((r) => `${r.month}:${r.skipped ? 's' : (r.queen?.membershipId ?? '-')}`)
    .join(',')}`;
  const thisMonthRow = data.rotation.find((r) => r.month === thisMonth);

  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2">
        <Link to={paths.bees.getHref(guildId)} className="tap-link">
          ‹ All bees in {guild.data.name}
        </Link>
      </nav>
      <div className="page-header">
        <h1>{data.name}</h1>
        {data.description && <p className="lead">{data.description}</p>}
        <dl className="facts">
          <div>
            <dt>Hand-over</dt>
            <dd>{handoverLabel(data.handover)}</dd>
          </div>
          <div>
            <dt>Months</dt>
            <dd>
              {formatMonth(data.startMonth)} to {formatMonth(lastMonth(data.startMonth, data.months))} ({data.months}{' '}
              {data.months === 1 ? 'month' : 'months'})
            </dd>
          </div>
          <div>
            <dt>Organiser</dt>
            <dd>{data.organiser.name}</dd>
          </div>
        </dl>
        {thisMonthRow && !thisMonthRow.skipped && (
          <Link to={paths.round.getHref(guildId, data.id, thisMonth)} className="btn btn-primary mt-2">
            This month's block ({formatMonth(thisMonth)})
          </Link>
        )}
        <a href={beeSchedulePdfHref(guildId, String(data.id))} className="btn btn-outline-primary mt-2 ms-sm-2" target="_blank" rel="noopener">
          Print the schedule (PDF)
        </a>
      </div>

      <Row className="g-4">
        <Col lg={5}>
          <Card as="section" aria-labelledby="my-place-heading" className="mb-4">
            <Card.Body>
              <h2 id="my-place-heading" className="h3 mb-3">
                You and this bee
              </h2>
              <MyPlace guildId={guildId} bee={data} />
            </Card.Body>
          </Card>
          <section aria-labelledby="makers-heading" className="mb-4">
            <h2 id="makers-heading" className="h3 mb-3">
              Makers <span className="text-body-secondary fw-normal">({data.members.filter((m) => m.status !== 'invited').length})</span>
            </h2>
            <BeeMembers guildId={guildId} bee={data} />
          </section>
          {data.isOrganiser && (
            <Card as="section" aria-labelledby="invite-heading" className="mb-4">
              <Card.Body>
                <h2 id="invite-heading" className="h3 mb-3">
                  Invite guild members
                </h2>
                {members.isPending && <PageSpinner label="Loading the guild's members" />}
                {members.isError && <ErrorAlert error={members.error} />}
                {members.data && <InviteMakersForm guildId={guildId} beeId={beeId} candidates={candidates} />}
              </Card.Body>
            </Card>
          )}
          {data.isOrganiser && (
            <Card as="section" aria-labelledby="add-paper-heading" className="mb-4">
              <Card.Body>
                <h2 id="add-paper-heading" className="h3 mb-3">
                  Add a member who does not sign in
                </h2>
                <AddPaperMakersForm guildId={guildId} beeId={beeId} candidates={data.addable ?? []} />
              </Card.Body>
            </Card>
          )}
        </Col>
        <Col lg={7}>
          <section aria-labelledby="rotation-heading" className="mb-4">
            <h2 id="rotation-heading" className="h3 mb-3">
              Queens, month by month
            </h2>
            <RotationTable guildId={guildId} bee={data} thisMonth={thisMonth} />
          </section>
          {data.isOrganiser && (
            <section aria-labelledby="order-heading">
              <h2 id="order-heading" className="h3 mb-3">
                Change the queen order
              </h2>
              <Card as="section" aria-labelledby="shuffle-heading" className="mb-3">
                <Card.Body>
                  <h3 id="shuffle-heading" className="h4">
                    Shuffle
                  </h3>
                  <ShuffleRotation guildId={guildId} bee={data} thisMonth={thisMonth} />
                </Card.Body>
              </Card>
              <Card as="section" aria-labelledby="manual-heading" className="mb-3">
                <Card.Body>
                  <h3 id="manual-heading" className="h4">
                    Set the order by hand
                  </h3>
                  <ManualOrder key={rotationKey} guildId={guildId} bee={data} thisMonth={thisMonth} onSaved={setOrderSaved} />
                  <p role="status" aria-live="polite" className={orderSaved ? 'alert alert-success mt-3 mb-0' : 'visually-hidden'}>
                    {orderSaved}
                  </p>
                </Card.Body>
              </Card>
              <Card as="section" aria-labelledby="swap-heading" className="mb-3">
                <Card.Body>
                  <h3 id="swap-heading" className="h4">
                    Swap two months
                  </h3>
                  <SwapMonths guildId={guildId} bee={data} thisMonth={thisMonth} />
                </Card.Body>
              </Card>
            </section>
          )}
        </Col>
      </Row>
    </>
  );
}
