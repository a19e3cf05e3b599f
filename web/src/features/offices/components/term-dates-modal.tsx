import { TextareaField, TextField } from '@/components/ui/form-fields';
import { FormModal } from '@/components/ui/form-modal';
import type { Term } from '../api/get-offices';
import { termDatesSchema, type TermDatesValues, type UpdateTermInput } from '../api/update-term';

type TermDatesModalProps = {
  term: Term | null;
  onHide: () => void;
  onSave: (term: Term, input: UpdateTermInput) => Promise<unknown>;
};

/** "Set term dates": the first day in office, the day access ends (optional) and a note. */
export function TermDatesModal({ term, onHide, onSave }: TermDatesModalProps) {
  return (
    <FormModal<TermDatesValues>
      show={term !== null}
      onHide={onHide}
      titleId="term-dates-title"
      title={term && `${term.roleLabel}: ${term.name}`}
      initialValues={{ startsOn: term?.startsOn ?? '', endsOn: term?.endsOn ?? '', note: term?.note ?? '' }}
      validationSchema={termDatesSchema}
      onSubmit={(values) => onSave(term!, { startsOn: values.startsOn, endsOn: values.endsOn || null, note: values.note.trim() })}
      submitLabel="Save dates"
    >
      <TextField name="startsOn" label="First day in office" type="date" />
      <TextField
        name="endsOn"
        label="Access ends on"
        type="date"
        optional
        help="She can no longer act in this office from the start of this day. Leave it empty if there is no end date."
      />
      <TextareaField name="note" label="Note" optional rows={2} />
    </FormModal>
  );
}
