import { Form, Formik } from 'formik';
import { CheckboxGroupField } from '@/components/ui/form-fields';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import { inviteBeeMembersSchema, useInviteBeeMembers, type InviteBeeMembersValues } from '../api/invite-bee-members';

type Candidate = { membershipId: number | string; name: string };

export function InviteMakersForm({ guildId, beeId, candidates }: { guildId: string; beeId: string; candidates: Candidate[] }) {
  const invite = useInviteBeeMembers(guildId, beeId);
  const initialValues: InviteBeeMembersValues = { membershipIds: [] };
  const options = [...candidates]
    .sort((a, b) => a.name.localeCompare(b.name))
    .map((c) => ({ value: String(c.membershipId), label: c.name }));
  return (
    <Formik
      initialValues={initialValues}
      validationSchema={inviteBeeMembersSchema}
      onSubmit={async (values, helpers) => {
        helpers.setStatus(undefined);
        try {
          await invite.mutateAsync(values.membershipIds.map(Number));
          const names = options.filter((o) => values.membershipIds.includes(o.value)).map((o) => o.label);
          helpers.resetForm({
            values: initialValues,
            status: { success: `Invited ${names.join(', ')}. They get an e-mail and join from the bee's page.` },
          });
        } catch (error) {
          applyServerErrors(error, helpers, values, { membershipIds: 'membershipIds' });
        }
      }}
    >
      <Form noValidate aria-label="Invite guild members to the bee">
        <FormAlert />
        {options.length === 0 ? (
          <p>Everyone in the guild is already in this bee or invited.</p>
        ) : (
          <>
            <CheckboxGroupField
              name="membershipIds"
              legend="Guild members not in the bee yet"
              help="Tick everyone you want to invite."
              options={options}
            />
            <SubmitButton busyLabel="Inviting">Invite to the bee</SubmitButton>
          </>
        )}
      </Form>
    </Formik>
  );
}
