import { useState } from 'react';
import { useParams, useSearchParams } from 'react-router-dom';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { usePageTitle } from '@/components/ui/page-title';
import { useDuesPlans } from '@/features/dues/api/get-dues-plans';
import { ledgerCsvHref, ledgerFiltersFromSearch, ledgerQueryString, useLedger, type LedgerRow } from '@/features/dues/api/get-ledger';
import { useRefundInvoice } from '@/features/dues/api/refund-invoice';
import { useVoidInvoice } from '@/features/dues/api/void-invoice';
import { LedgerFilters } from '@/features/dues/components/ledger-filters';
import { LedgerTable } from '@/features/dues/components/ledger-table';
import { RefundDialog } from '@/features/dues/components/refund-dialog';
import { formatMoney } from '@/features/dues/lib/money';
import { useGuild } from '@/features/members/api/get-guild';

export default function TreasurerLedgerRoute() {
  const { guildId = '' } = useParams();
  const [search, setSearch] = useSearchParams();
  const filters = ledgerFiltersFromSearch(search);
  const guild = useGuild(guildId);
  const ledger = useLedger(guildId, filters);
  const plans = useDuesPlans(guildId);
  const refund = useRefundInvoice(guildId);
  const voidInvoice = useVoidInvoice(guildId);
  const [refunding, setRefunding] = useState<LedgerRow | null>(null);
  const [announcement, setAnnouncement] = useState('');
  usePageTitle('Ledger');
  const currency = guild.data?.currency ?? 'USD';

  return (
    <section aria-labelledby="ledger-heading">
      <div className="d-flex flex-wrap justify-content-between align-items-center gap-2 mb-3">
        <h2 id="ledger-heading" className="mb-0">
          Ledger
        </h2>
        <a href={ledgerCsvHref(guildId, filters)} className="btn btn-outline-primary" download>
          Download these payments (CSV)
        </a>
      </div>
      <LedgerFilters
        filters={filters}
        years={ledger.data?.years ?? []}
        plans={plans.data ?? []}
        onApply={(next) => {
          setAnnouncement('');
          setSearch(new URLSearchParams(ledgerQueryString(next)));
        }}
      />
      <p role="status" className={announcement ? 'alert alert-success' : 'visually-hidden'}>
        {announcement || (ledger.data && !ledger.isFetching ? `${ledger.data.totals.count} invoices shown.` : '')}
      </p>
      <ErrorAlert error={voidInvoice.error} />
      {ledger.isPending && <PageSpinner label="Loading the ledger" />}
      {ledger.isError && <ErrorAlert error={ledger.error} />}
      {ledger.data && (
        <div className={ledger.isPlaceholderData ? 'opacity-50' : undefined} aria-busy={ledger.isPlaceholderData || undefined}>
          <LedgerTable
            ledger={ledger.data}
            currency={currency}
            onRefund={(row) => {
              setAnnouncement('');
              setRefunding(row);
            }}
            voiding={voidInvoice.isPending}
            onVoid={(row) =>
              voidInvoice.mutateAsync(row.invoiceId).then(() => setAnnouncement(`The invoice for ${row.memberName} is cancelled.`))
            }
          />
        </div>
      )}
      <RefundDialog
        row={refunding}
        currency={currency}
        onHide={() => setRefunding(null)}
        onRefund={(row, input) =>
          refund
            .mutateAsync({ invoiceId: row.invoiceId, input })
            .then(() => setAnnouncement(`Refunded ${formatMoney(input.amountCents, currency)} to ${row.memberName}.`))
        }
      />
    </section>
  );
}
