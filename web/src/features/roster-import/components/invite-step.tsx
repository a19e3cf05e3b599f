import { Form as FormikForm, Formik } from 'formik';
import Alert from 'react-bootstrap/Alert';
import { FormAlert } from '@/components/ui/form-alert';
import { CheckboxGroupField } from '@/components/ui/form-fields';
import { applyServerErrors } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import type { InvitableMember } from '../api/import-roster';
import type { InviteImportedResult } from '../api/invite-imported';

type Values = { membershipIds: string[] };

/** Step 4: invitations for the imported members who have an e-mail, so they can sign in. */
export function InviteStep({
  members,
  result,
  onInvite,
}: {
  members: InvitableMember[];
  result: InviteImportedResult | null;
  onInvite: (membershipIds: number[]) => Promise<unknown>;
}) {
  const waiting = members.filter((m) => !m.invited);
  if (result)
    return (
      <section aria-labelledby="invite-heading">
        <h2 id="invite-heading" className="h4">Invitations</h2>
        <Alert variant="success" role="status" className="fs-5">
          {result.sent.length === 1 ? '1 invitation was sent.' : `${result.sent.length.toLocaleString('en-US')} invitations were sent.`} Each member gets an
          e-mail with a link to choose her password.
        </Alert>
        {result.skipped.length > 0 && (
          <ul aria-label="Not invited">
            {result.skipped.map((s) => (
              <li key={s.membershipId}>
                {s.name ?? `Member ${s.membershipId}`}: {s.reason}
              </li>
            ))}
          </ul>
        )}
      </section>
    );
  if (members.length === 0) return null;
  return (
    <section aria-labelledby="invite-heading">
      <h2 id="invite-heading" className="h4">Invite them to sign in</h2>
      {waiting.length < members.length && (
        <p>
          {members.length - waiting.length === 1 ? '1 member already has' : `${members.length - waiting.length} members already have`} an invitation waiting.
        </p>
      )}
      {waiting.length === 0 ? (
        <p className="fs-5">Everyone with an e-mail has been invited.</p>
      ) : (
        <Formik<Values>
          initialValues={{ membershipIds: waiting.map((m) => String(m.membershipId)) }}
          validate={(v) => (v.membershipIds.length ? {} : { membershipIds: 'Tick at least one member, or leave this page.' })}
          onSubmit={async (values, helpers) => {
            try {
              await onInvite(values.membershipIds.map(Number));
            } catch (e) {
              applyServerErrors(e, helpers, values);
            }
          }}
        >
          {({ values }) => (
            <FormikForm noValidate>
              <FormAlert />
              <CheckboxGroupField
                name="membershipIds"
                legend="Members with an e-mail who cannot sign in yet"
                help="Each one gets an e-mail with a link to choose a password. Untick anyone you would rather invite later."
                options={waiting.map((m) => ({ value: String(m.membershipId), label: `${m.name} (${m.email})` }))}
              />
              <SubmitButton busyLabel="Sending" className="btn-lg">
                {values.membershipIds.length === 1 ? 'Send 1 invitation' : `Send ${values.membershipIds.length.toLocaleString('en-US')} invitations`}
              </SubmitButton>
            </FormikForm>
          )}
        </Formik>
      )}
    </section>
  );
}
