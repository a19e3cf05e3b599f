import Card from 'react-bootstrap/Card';
import { useParams, useSearchParams } from 'react-router-dom';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { usePageTitle } from '@/components/ui/page-title';
import { useDuesPlans } from '@/features/dues/api/get-dues-plans';
import { useRoster } from '@/features/dues/api/get-roster';
import { useRecordPayment } from '@/features/dues/api/record-payment';
import { RecordPaymentForm } from '@/features/dues/components/record-payment-form';
import { todayIn } from '@/features/dues/lib/format';
import { useGuild } from '@/features/members/api/get-guild';

export default function TreasurerRecordRoute() {
  const { guildId = '' } = useParams();
  const [search] = useSearchParams();
  const guild = useGuild(guildId);
  const roster = useRoster(guildId);
  const plans = useDuesPlans(guildId);
  const record = useRecordPayment(guildId);
  usePageTitle('Record a payment');

  const failure = roster.error ?? plans.error;
  return (
    <section aria-labelledby="record-heading" className="record-payment">
      <h2 id="record-heading" className="mb-2">
        Record a payment
      </h2>
      <p className="mb-3">For dues paid in cash or by cheque. Card payments are recorded by themselves.</p>
      {(roster.isPending || plans.isPending || guild.isPending) && !failure && <PageSpinner label="Loading members and plans" />}
      <ErrorAlert error={failure} />
      {roster.data && plans.data && guild.data && (
        <Card>
          <Card.Body>
            <RecordPaymentForm
              members={roster.data}
              plans={plans.data}
              currency={guild.data.currency}
              today={todayIn(guild.data.timeZone)}
              membershipId={search.get('member') ?? ''}
              onRecord={(input) => record.mutateAsync(input)}
            />
          </Card.Body>
        </Card>
      )}
    </section>
  );
}
