import { useParams } from 'react-router-dom';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { usePageTitle } from '@/components/ui/page-title';
import { useDuesAudit } from '@/features/dues/api/get-dues-audit';
import { AuditList } from '@/features/dues/components/audit-list';
import { useGuild } from '@/features/members/api/get-guild';

export default function TreasurerAuditRoute() {
  const { guildId = '' } = useParams();
  const guild = useGuild(guildId);
  const audit = useDuesAudit(guildId);
  usePageTitle('Audit log');
  return (
    <section aria-labelledby="audit-heading">
      <h2 id="audit-heading" className="mb-2">
        Audit log
      </h2>
      <p>Every change to payments, refunds, settings and plans, with who made it. Times are guild time.</p>
      {audit.isPending && <PageSpinner label="Loading the audit log" />}
      <ErrorAlert error={audit.error} />
      {audit.data && <AuditList entries={audit.data} timeZone={guild.data?.timeZone} />}
    </section>
  );
}
