import Alert from 'react-bootstrap/Alert';
import Button from 'react-bootstrap/Button';
import Card from 'react-bootstrap/Card';
import { Link, useParams } from 'react-router-dom';
import { NotFound } from '@/components/errors/not-found';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { usePageTitle } from '@/components/ui/page-title';
import { paths } from '@/config/paths';
import { useBee } from '@/features/bees/api/get-bee';
import { roundQueryOptions, useRound, type Round, type RoundPage } from '@/features/bees/api/get-round';
import { usePublishRound } from '@/features/bees/api/publish-round';
import { useSaveRound } from '@/features/bees/api/save-round';
import { useSendNudges } from '@/features/bees/api/send-nudges';
import { useUpdateBlock } from '@/features/bees/api/update-block';
import { MakersGrid } from '@/features/bees/components/makers-grid';
import { MyBlockForm } from '@/features/bees/components/my-block-form';
import { RoundDetails } from '@/features/bees/components/round-details';
import { RoundFiles, UploadRoundFile } from '@/features/bees/components/round-files';
import { RoundForm } from '@/features/bees/components/round-form';
import { dashboardQueryOptions } from '@/features/dashboard/api/get-dashboard';
import { useGuild } from '@/features/members/api/get-guild';
import { BlockSizeCheck } from '@/features/size-check/components/block-size-check';
import { SizeCheckPanel, type SizeTarget } from '@/features/size-check/components/size-check-panel';
import { isApiError } from '@/lib/api-client';
import { useUser } from '@/lib/auth';
import { formatDateTime, formatMonth, isMonth } from '@/lib/dates';

type PublishProps = {
  guildId: string;
  beeId: string;
  month: string;
  page: RoundPage;
  round: Round | null;
  timeZone?: string;
  dirty: boolean;
};

function PublishStep({ guildId, beeId, month, page, round, timeZone, dirty }: PublishProps) {
  const publish = usePublishRound(guildId, beeId, month);
  const sendAt = formatDateTime(round?.sendAt ?? page.sendAt ?? page.defaultSendAt, timeZone);
  return (
    <section aria-labelledby="publish-heading" className="publish-step mt-4">
      <h2 id="publish-heading" className="h3">
        Send it to the makers
      </h2>
      {!round && <p>Save the round first. Then you can publish it.</p>}
      {round?.status === 'draft' && (
        <>
          <p>
            Saving keeps the round as a draft: nobody is e-mailed. When you publish, every maker gets an e-mail with the block
            {sendAt ? (
              <>
                {' '}
                on <strong>{sendAt}</strong> (guild time)
              </>
            ) : (
              ' at the send date and time above'
            )}
            . If that time has already passed, the e-mail goes out straight away.
          </p>
          {dirty && <p className="fw-bold">You have changes that are not saved yet. Save them first so the makers see them.</p>}
          <ErrorAlert error={publish.error} />
          <Button variant="primary" disabled={dirty || publish.isPending} onClick={() => publish.mutate()}>
            {publish.isPending ? 'Publishing…' : 'Publish the round'}
          </Button>
        </>
      )}
      {round?.status === 'published' && (
        <p>
          Published{round.publishedAt ? ` on ${formatDateTime(round.publishedAt, timeZone)}` : ''}.{' '}
          {round.sentAt
            ? `The makers were e-mailed on ${formatDateTime(round.sentAt, timeZone)}.`
            : `The makers get the e-mail on ${sendAt} (guild time).`}{' '}
          If you save changes now, the makers get a short e-mail saying what changed.
        </p>
      )}
      <div role="status" aria-live="polite" className="visually-hidden">
        {publish.isSuccess ? 'The round is published.' : ''}
      </div>
    </section>
  );
}

export default function RoundRoute() {
  const { guildId = '', beeId = '', month = '' } = useParams();
  const guild = useGuild(guildId);
  const bee = useBee(guildId, beeId);
  const roundQuery = useRound(guildId, beeId, month);
  const { data: user } = useUser();
  const save = useSaveRound(guildId, beeId, month);
  const updateBlock = useUpdateBlock(guildId, beeId, month, [dashboardQueryOptions().queryKey]);
  const nudges = useSendNudges(guildId, beeId, month);
  const monthName = isMonth(month) ? formatMonth(month) : month;
  const title = roundQuery.data?.round?.title;
  usePageTitle(title ? `${title}, ${monthName}` : `${monthName} block`);

  if (!isMonth(month)) return <NotFound />;
  if (roundQuery.isPending || bee.isPending) return <PageSpinner label="Loading the round" />;
  const failure = roundQuery.error ?? bee.error;
  if (failure || !roundQuery.data || !bee.data) {
    if (isApiError(failure) && failure.status === 404) return <NotFound />;
    return (
      <>
        <h1>{monthName} block</h1>
        <ErrorAlert error={failure} />
      </>
    );
  }

  const page = roundQuery.data;
  const round = page.round;
  const timeZone = guild.data?.timeZone;
  const isBeeMember = page.isBeeMember ?? (bee.data.isOrganiser || bee.data.myStatus === 'active' || bee.data.myStatus === 'organiser');
  const isOrganiser = page.isOrganiser ?? bee.data.isOrganiser;
  const sent = Boolean(round?.sentAt);
  const roundKey = [roundQueryOptions(guildId, beeId, month).queryKey];
  const sizeTarget: SizeTarget | null = round
    ? {
        unfinished: `${round.unfinished.widthText} x ${round.unfinished.heightText}`,
        finished: `${round.finished.widthText} x ${round.finished.heightText}`,
        untrimmed: round.trimMode === 'untrimmed',
      }
    : null;
  const myBlock = page.isMaker
    ? page.myMembershipId !== undefined
      ? page.blocks.find((b) => b.membershipId === page.myMembershipId)
      : page.canEdit
        ? page.blocks.find((b) => b.name === user?.name)
        : page.blocks[0]
    : undefined;

  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2">
        <Link to={paths.bee.getHref(guildId, beeId)} className="tap-link">
          ‹ {bee.data.name}
        </Link>
      </nav>
      <div className="page-header">
        <h1>
          {monthName}
          {round?.title ? `: ${round.title}` : ' block'}
        </h1>
        <p className="lead mb-1">
          {page.queen ? (
            <>
              Queen: <strong>{page.queen.name}</strong>
            </>
          ) : (
            'No queen this month.'
          )}
        </p>
        <p className="mb-0">
          {bee.data.name} · {round ? (round.status === 'published' ? 'Published' : 'Draft') : 'Not started'}
        </p>
        {page.canEdit && (
          <nav aria-label="On this page" className="d-flex flex-wrap gap-2 mt-3">
            <a href="#edit-round" className="btn btn-outline-primary">
              Edit the block
            </a>
            <a href="#makers-blocks" className="btn btn-outline-primary">
              Makers' blocks
            </a>
          </nav>
        )}
      </div>

      {round && round.status === 'draft' && !page.canEdit && (
        <Alert variant="light" className="border">
          This is a draft. The queen may still change it; you get an e-mail when she publishes it.
        </Alert>
      )}

      {myBlock && (
        <Card as="section" aria-labelledby="my-block-heading" className="mb-4">
          <Card.Body>
            <h2 id="my-block-heading" className="h3 mb-3">
              My block
            </h2>
            <MyBlockForm
              key={myBlock.membershipId}
              block={myBlock}
              deliveryMethod={round?.deliveryMethod ?? bee.data.handover}
              onSave={(input) => updateBlock.mutateAsync({ membershipId: myBlock.membershipId, input })}
            />
            {sent && (
              <div className="mt-4 pt-3 border-top">
                <SizeCheckPanel
                  guildId={guildId}
                  beeId={beeId}
                  month={month}
                  membershipId={myBlock.membershipId}
                  latest={myBlock.sizeCheck}
                  target={sizeTarget}
                  timeZone={timeZone}
                  alsoInvalidate={roundKey}
                />
              </div>
            )}
          </Card.Body>
        </Card>
      )}

      <section aria-labelledby="block-heading" className="mb-4">
        <h2 id="block-heading" className="h3 mb-3">
          The block
        </h2>
        {page.skipped ? (
          <p>This month is skipped: there is no block to make.</p>
        ) : round ? (
          <RoundDetails guildId={guildId} beeId={beeId} page={page} round={round} timeZone={timeZone} isBeeMember={isBeeMember} />
        ) : (
          <p>
            {page.queen ? `${page.queen.name} has not set this month's block yet.` : 'Nobody is queen this month.'}
            {page.canEdit && ' Fill in the form below.'}
          </p>
        )}
      </section>

      {page.canEdit && (
        <>
          <Card as="section" id="edit-round" tabIndex={-1} aria-labelledby="edit-heading" className="mb-4">
            <Card.Body>
              <h2 id="edit-heading" className="h3 mb-3">
                {round ? 'Edit the block' : 'Set the block'}
              </h2>
              <RoundForm
                key={month}
                round={round}
                month={month}
                handover={bee.data.handover}
                onSave={(input) => save.mutateAsync(input)}
                footer={({ dirty }) => (
                  <PublishStep
                    guildId={guildId}
                    beeId={beeId}
                    month={month}
                    page={page}
                    round={round}
                    timeZone={timeZone}
                    dirty={dirty}
                  />
                )}
              />
            </Card.Body>
          </Card>
          <Card as="section" aria-labelledby="files-heading" className="mb-4">
            <Card.Body>
              <h2 id="files-heading" className="h3 mb-3">
                Pattern files
              </h2>
              {round ? (
                <>
                  <RoundFiles guildId={guildId} beeId={beeId} month={month} files={round.files} canEdit />
                  <UploadRoundFile guildId={guildId} beeId={beeId} month={month} />
                </>
              ) : (
                <p className="mb-0">Save the round first, then add a PDF or pictures of the pattern.</p>
              )}
            </Card.Body>
          </Card>
          <section id="makers-blocks" tabIndex={-1} aria-labelledby="makers-heading" className="mb-4">
            <h2 id="makers-heading" className="h3 mb-3">
              Makers' blocks
            </h2>
            {sent ? (
              <MakersGrid
                blocks={page.blocks}
                canMarkReceived={page.canEdit}
                canSetOnBehalf={isOrganiser}
                onUpdate={(membershipId, input) => updateBlock.mutateAsync({ membershipId, input })}
                onNudge={() => nudges.mutateAsync()}
                renderExtra={(block) => (
                  <BlockSizeCheck
                    guildId={guildId}
                    beeId={beeId}
                    month={month}
                    membershipId={block.membershipId}
                    makerName={block.name}
                    latest={block.sizeCheck}
                    target={sizeTarget}
                    timeZone={timeZone}
                    alsoInvalidate={roundKey}
                    canCheckOnBehalf={isOrganiser && block.membershipId !== (page.myMembershipId ?? myBlock?.membershipId)}
                  />
                )}
              />
            ) : (
              <p>
                {round?.status === 'published'
                  ? 'The round is published. Each maker appears here with her block once the e-mail has gone out.'
                  : 'Each maker appears here with her block once you publish the round and the e-mail has gone out.'}
              </p>
            )}
          </section>
        </>
      )}
    </>
  );
}
