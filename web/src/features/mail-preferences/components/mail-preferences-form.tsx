import Form from 'react-bootstrap/Form';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { useMailPreferences, useSaveMailPreferences } from '../api/mail-preferences';

/** One switch: reminder e-mails on or off. Saved as soon as it changes. */
export function MailPreferencesForm() {
  const prefs = useMailPreferences();
  const save = useSaveMailPreferences();
  if (prefs.isPending) return <PageSpinner label="Loading your e-mail choices" />;
  if (prefs.isError) return <ErrorAlert error={prefs.error} />;
  const on = save.isPending && save.variables ? save.variables.reminders : prefs.data.reminders;
  return (
    <>
      <Form.Check
        type="switch"
        id="reminders-switch"
        label="Send me reminder e-mails"
        checked={on}
        disabled={save.isPending}
        onChange={(e) => save.mutate({ reminders: e.currentTarget.checked })}
        aria-describedby="reminders-help"
      />
      <Form.Text id="reminders-help" className="d-block mt-2">
        Reminders are the notes about blocks coming due, setting your month's block and dues to renew. Receipts, invitations,
        password resets and your own bee assignments always come.
      </Form.Text>
      <p role="status" className="mt-2 mb-0">
        {save.isSuccess ? (save.data.reminders ? 'Saved: reminders are on.' : 'Saved: no more reminders.') : ''}
      </p>
      <ErrorAlert error={save.error} />
    </>
  );
}
