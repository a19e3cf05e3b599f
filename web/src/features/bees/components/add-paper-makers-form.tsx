import { Form, Formik } from 'formik';
import { CheckboxGroupField } from '@/components/ui/form-fields';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import { addBeeMembersSchema, useAddBeeMembers, type AddBeeMembersValues } from '../api/add-bee-members';

type Candidate = { membershipId: number | string; name: string };

/** For the organiser: members who do not sign in cannot accept an invitation, so she adds them herself. */
export function AddPaperMakersForm({ guildId, beeId, candidates }: { guildId: string; beeId: string; candidates: Candidate[] }) {
  const add = useAddBeeMembers(guildId, beeId);
  const initialValues: AddBeeMembersValues = { membershipIds: [] };
  const options = [...candidates].sort((a, b) => a.name.localeCompare(b.name)).map((c) => ({ value: String(c.membershipId), label: c.name }));
  return (
    <Formik
      initialValues={initialValues}
      validationSchema={addBeeMembersSchema}
      onSubmit={async (values, helpers) => {
        helpers.setStatus(undefined);
        try {
          await add.mutateAsync(values.membershipIds.map(Number));
          const names = options.filter((o) => values.membershipIds.includes(o.value)).map((o) => o.label);
          helpers.resetForm({
            values: initialValues,
            status: { success: `Added ${names.join(', ')}. Print the schedule for her, and mark her blocks on each month's page.` },
          });
        } catch (error) {
          applyServerErrors(error, helpers, values, { membershipIds: 'membershipIds' });
        }
      }}
    >
      <Form noValidate aria-label="Add members who do not sign in">
        <FormAlert />
        {options.length === 0 ? (
          <p>Every member kept on paper is already in this bee.</p>
        ) : (
          <>
            <CheckboxGroupField
              name="membershipIds"
              legend="Members kept on paper"
              help="They have no e-mail or have not signed in yet, so they cannot accept an invitation. You mark their blocks for them."
              options={options}
            />
            <SubmitButton busyLabel="Adding">Add to the bee</SubmitButton>
          </>
        )}
      </Form>
    </Formik>
  );
}
