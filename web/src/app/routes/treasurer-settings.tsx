import Card from 'react-bootstrap/Card';
import Col from 'react-bootstrap/Col';
import Row from 'react-bootstrap/Row';
import { useParams } from 'react-router-dom';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { usePageTitle } from '@/components/ui/page-title';
import { useCreateDuesPlan } from '@/features/dues/api/create-dues-plan';
import { useDuesPlans } from '@/features/dues/api/get-dues-plans';
import { useDuesSettings } from '@/features/dues/api/get-dues-settings';
import { useUpdateDuesPlan } from '@/features/dues/api/update-dues-plan';
import { useUpdateDuesSettings } from '@/features/dues/api/update-dues-settings';
import { DuesSettingsForm } from '@/features/dues/components/dues-settings-form';
import { PlansEditor } from '@/features/dues/components/plans-editor';

export default function TreasurerSettingsRoute() {
  const { guildId = '' } = useParams();
  const settings = useDuesSettings(guildId);
  const plans = useDuesPlans(guildId);
  const saveSettings = useUpdateDuesSettings(guildId);
  const createPlan = useCreateDuesPlan(guildId);
  const updatePlan = useUpdateDuesPlan(guildId);
  usePageTitle('Dues settings and plans');

  return (
    <Row className="g-4">
      <Col xl={6}>
        <Card as="section" aria-labelledby="plans-heading">
          <Card.Body>
            <h2 id="plans-heading" className="h3 mb-3">
              Plans
            </h2>
            {plans.isPending && <PageSpinner label="Loading the plans" />}
            <ErrorAlert error={plans.error} />
            {plans.data && settings.data && (
              <PlansEditor
                plans={plans.data}
                currency={settings.data.currency}
                onSave={(planId, input) => (planId === null ? createPlan.mutateAsync(input) : updatePlan.mutateAsync({ planId, input }))}
              />
            )}
          </Card.Body>
        </Card>
      </Col>
      <Col xl={6}>
        <Card as="section" aria-labelledby="settings-heading">
          <Card.Body>
            <h2 id="settings-heading" className="h3 mb-3">
              When dues are due
            </h2>
            {settings.isPending && <PageSpinner label="Loading the settings" />}
            <ErrorAlert error={settings.error} />
            {settings.data && <DuesSettingsForm settings={settings.data} onSave={(input) => saveSettings.mutateAsync(input)} />}
          </Card.Body>
        </Card>
      </Col>
    </Row>
  );
}
