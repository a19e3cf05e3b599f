import Form from 'react-bootstrap/Form';
import { useParams, useSearchParams } from 'react-router-dom';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { usePageTitle } from '@/components/ui/page-title';
import { reportCsvHref, reportPdfHref, useDuesReport } from '@/features/dues/api/get-dues-report';
import { useDuesSettings } from '@/features/dues/api/get-dues-settings';
import { DuesReportView } from '@/features/dues/components/dues-report-view';
import { useGuild } from '@/features/members/api/get-guild';

export default function TreasurerReportRoute() {
  const { guildId = '' } = useParams();
  const [search, setSearch] = useSearchParams();
  const guild = useGuild(guildId);
  const settings = useDuesSettings(guildId);
  const year = search.get('year') ?? settings.data?.currentYear.label ?? '';
  const report = useDuesReport(guildId, year);
  usePageTitle(year ? `Report ${year}` : 'Report');
  const currency = guild.data?.currency ?? 'USD';
  const years = [...new Set([year, ...(report.data?.years ?? [])].filter(Boolean))].sort().reverse();

  return (
    <section aria-labelledby="report-heading">
      <h2 id="report-heading" className="mb-3">
        Report{report.data ? ` for ${report.data.year}` : ''}
      </h2>
      <div className="d-flex flex-wrap align-items-end gap-3 mb-4">
        <Form.Group controlId="report-year">
          <Form.Label>Membership year</Form.Label>
          <Form.Select value={year} onChange={(e) => setSearch({ year: e.currentTarget.value })}>
            {years.map((y) => (
              <option key={y} value={y}>
                {y}
              </option>
            ))}
          </Form.Select>
        </Form.Group>
        <a href={reportCsvHref(guildId, year)} className="btn btn-outline-primary" download>
          Download (CSV)
        </a>
        <a href={reportPdfHref(guildId, year)} className="btn btn-outline-primary" target="_blank" rel="noopener">
          Printable report (PDF)<span className="visually-hidden">, opens in a new tab</span>
        </a>
      </div>
      {(settings.isPending || report.isPending) && <PageSpinner label="Adding up the year" />}
      <ErrorAlert error={settings.error ?? report.error} />
      {report.data && (
        <div className={report.isPlaceholderData ? 'opacity-50' : undefined}>
          <DuesReportView report={report.data} currency={currency} />
        </div>
      )}
    </section>
  );
}
