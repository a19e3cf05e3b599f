import { useCallback, useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { NotFound } from '@/components/errors/not-found';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { usePageTitle } from '@/components/ui/page-title';
import { paths } from '@/config/paths';
import { OFFICER_INVITE_ROLES, type Role } from '@/config/roles';
import { useGuild } from '@/features/members/api/get-guild';
import { useImportRoster, type RosterImportResult } from '@/features/roster-import/api/import-roster';
import { useInviteImported, type InviteImportedResult } from '@/features/roster-import/api/invite-imported';
import { usePreviewRoster, type RosterPreview } from '@/features/roster-import/api/preview-roster';
import type { RosterSource } from '@/features/roster-import/api/roster-body';
import { ImportResult } from '@/features/roster-import/components/import-result';
import { InviteStep } from '@/features/roster-import/components/invite-step';
import { PreviewStep, type PreviewChoices } from '@/features/roster-import/components/preview-step';
import { SourceStep } from '@/features/roster-import/components/source-step';
import { isApiError } from '@/lib/api-client';

type View = { page: number; onlyProblems: boolean };

export default function RosterImportRoute() {
  const { guildId = '' } = useParams();
  const guild = useGuild(guildId);
  const previewRoster = usePreviewRoster(guildId);
  const importRoster = useImportRoster(guildId);
  const inviteImported = useInviteImported(guildId);
  const [source, setSource] = useState<RosterSource | null>(null);
  const [sourceKey, setSourceKey] = useState(0);
  const [preview, setPreview] = useState<RosterPreview | null>(null);
  const [choices, setChoices] = useState<PreviewChoices | null>(null);
  const [view, setView] = useState<View>({ page: 1, onlyProblems: false });
  const [result, setResult] = useState<RosterImportResult | null>(null);
  const [invited, setInvited] = useState<InviteImportedResult | null>(null);
  usePageTitle('Import a roster');

  const { mutateAsync: runPreview, reset: resetPreview } = previewRoster;
  const refresh = useCallback(
    async (src: RosterSource, next: PreviewChoices | null, nextView: View) => {
      const p = await runPreview({ source: src, ...(next ?? {}), ...nextView });
      setPreview(p);
      return p;
    },
    [runPreview],
  );
  const onChoicesChange = useCallback(
    (next: PreviewChoices) => {
      if (!source) return;
      setChoices(next);
      const v = { ...view, page: 1 };
      setView(v);
      // A refused mapping shows its message above the rows; the choices stay as she set them.
      refresh(source, next, v).catch(() => undefined);
    },
    [source, view, refresh],
  );

  if (guild.isPending) return <PageSpinner label="Loading the guild" />;
  if (guild.isError) {
    if (isApiError(guild.error) && guild.error.status === 404) return <NotFound />;
    return <ErrorAlert error={guild.error} />;
  }
  const allowed = guild.data.myRoles.some((r) => OFFICER_INVITE_ROLES.includes(r as Role));
  const backLink = (
    <Link to={paths.members.getHref(guildId)} className="btn btn-outline-primary">
      Back to the members
    </Link>
  );
  if (!allowed)
    return (
      <>
        <h1>Import a roster</h1>
        <p className="fs-5">Only the guild's admins and membership chair can import a roster.</p>
        {backLink}
      </>
    );

  const startOver = () => {
    setSource(null);
    setPreview(null);
    setChoices(null);
    setView({ page: 1, onlyProblems: false });
    resetPreview();
    setSourceKey((k) => k + 1);
  };

  return (
    <>
      <div className="page-header">
        <h1>Import a roster from a spreadsheet</h1>
        <p className="lead mb-0">{guild.data.name}</p>
      </div>
      {result ? (
        <>
          <ImportResult result={result} />
          <InviteStep
            members={result.toInvite}
            result={invited}
            onInvite={async (ids) => setInvited(await inviteImported.mutateAsync(ids))}
          />
          <div className="d-flex gap-3 flex-wrap mt-4">
            {backLink}
          </div>
        </>
      ) : !preview || !source ? (
        <SourceStep
          key={sourceKey}
          onSubmit={async (src) => {
            const first = { page: 1, onlyProblems: false };
            await refresh(src, null, first);
            setSource(src);
            setView(first);
          }}
        />
      ) : (
        <PreviewStep
          key={sourceKey}
          preview={preview}
          busy={previewRoster.isPending}
          error={previewRoster.error}
          onChoicesChange={onChoicesChange}
          onPage={(page) => {
            const v = { ...view, page };
            setView(v);
            refresh(source, choices, v).catch(() => undefined);
          }}
          onOnlyProblems={(onlyProblems) => {
            const v = { page: 1, onlyProblems };
            setView(v);
            refresh(source, choices, v).catch(() => undefined);
          }}
          onImport={async (values) => setResult(await importRoster.mutateAsync({ source, mapping: values.mapping, dateOrder: values.dateOrder }))}
          onStartOver={startOver}
        />
      )}
    </>
  );
}
