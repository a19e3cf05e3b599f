import { FieldArray, Form, Formik, getIn, useFormikContext } from 'formik';
import { useEffect, useId, useRef } from 'react';
import Button from 'react-bootstrap/Button';
import Col from 'react-bootstrap/Col';
import Row from 'react-bootstrap/Row';
import { Link, useNavigate } from 'react-router-dom';
import { ConfirmAction } from '@/components/ui/confirm-action';
import { CheckboxField, SelectField, TextareaField, TextField } from '@/components/ui/form-fields';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import { formatInches } from '@/lib/inches';
import type { EntryPatch } from '../api/save-entry';
import type { Entry, Show } from '../api/types';
import {
  emptyEntryValues,
  ENTRY_FIELD_MAP,
  entrySchema,
  MAKERS_MAX,
  STORY_MAX,
  toEntryInput,
  toEntryPatch,
  toEntryValues,
  type EntryInput,
  type EntryValues,
} from '../lib/entry-form';
import { showPaths } from '../lib/paths';
import { readSize, sizeProblem } from '../lib/size-rule';

export type OnBehalfMember = { membershipId: number | string; name: string };

type EntryFormProps = {
  guildId: string;
  show: Pick<Show, 'id' | 'categories' | 'currency'>;
  /** Set when changing an entry; a new entry otherwise. */
  entry?: Entry | null;
  /** Her own name, the first maker of a new quilt. */
  makerName: string;
  /** Only for a chair entering a new quilt: the members she can enter for. */
  members?: OnBehalfMember[] | null;
  onCreate: (input: EntryInput) => Promise<Entry>;
  onUpdate: (input: EntryPatch) => Promise<Entry>;
  onSaved: (entry: Entry) => void;
};

/**
 * The perimeter as she types, and a plain refusal when the quilt breaks the chosen category's rule:
 * the api does not take such an entry. Once the same words show under the size field, only the
 * heading and what to do stay here, so they are not read out twice.
 */
function SizePreview({ show, perimeterId }: { show: EntryFormProps['show']; perimeterId: string }) {
  const { values, errors, touched, submitCount } = useFormikContext<EntryValues>();
  const size = readSize(values.widthIn, values.heightIn);
  const category = show.categories.find((c) => String(c.id) === values.categoryId);
  const problem = sizeProblem(category?.sizeRule, size);
  const shownUnderField = problem && errors[problem.field] === problem.message && (touched[problem.field] || submitCount > 0);
  return (
    <>
      <p id={perimeterId} className="perimeter-line fw-bold mb-2" data-testid="perimeter">
        {size ? `Perimeter ${formatInches(size.perimeterIn)} in` : 'Perimeter: type the width and height to see it.'}
      </p>
      <div role="status" className="mb-3">
        {problem && category && (
          <div className="size-warning" data-testid="size-warning">
            <strong className="d-block">It does not fit {category.name}.</strong>
            {shownUnderField ? '' : `${problem.message} `}Choose another category, or check the width and height.
          </div>
        )}
      </div>
    </>
  );
}

/** A chair entering for a member: the first maker follows the member she picks, unless it was changed by hand. */
function FollowEntrant({ members, makerName }: { members: OnBehalfMember[]; makerName: string }) {
  const { values, setFieldValue } = useFormikContext<EntryValues>();
  const filled = useRef(makerName);
  useEffect(() => {
    const member = members.find((m) => String(m.membershipId) === values.onBehalfOf);
    const name = member?.name ?? makerName;
    if ((values.makers[0] ?? '') === filled.current && name !== filled.current) {
      void setFieldValue('makers.0', name, false);
    }
    filled.current = name;
    // Only a change of member should change the maker.
  }, [values.onBehalfOf]);
  return null;
}

function MakersField() {
  const { values, errors, submitCount, touched } = useFormikContext<EntryValues>();
  const listRef = useRef<HTMLDivElement>(null);
  const focusLast = useRef(false);
  const count = values.makers.length;
  const groupError = typeof errors.makers === 'string' && (submitCount > 0 || getIn(touched, 'makers')) ? errors.makers : undefined;
  const errorId = useId();

  useEffect(() => {
    if (!focusLast.current) return;
    focusLast.current = false;
    const inputs = listRef.current?.querySelectorAll<HTMLInputElement>('input');
    inputs?.[inputs.length - 1]?.focus();
  }, [count]);

  return (
    // With a message for the whole list, the fieldset is where the form's focus-on-error lands
    // (it looks for .is-invalid), so she hears the question and its message, not one box.
    <fieldset
      className={groupError ? 'form-section is-invalid' : 'form-section'}
      tabIndex={groupError ? -1 : undefined}
      aria-describedby={groupError ? errorId : undefined}
    >
      <legend className="h5">Who made it</legend>
      <p className="text-body-secondary">Everyone who pieced or appliquéd the top. Add a line for each person.</p>
      <FieldArray name="makers">
        {({ push, remove }) => (
          <div ref={listRef}>
            {values.makers.map((_maker, i) => (
              <div key={i} className="maker-row d-flex align-items-end gap-2">
                <div className="flex-grow-1 min-w-0">
                  <TextField name={`makers.${i}`} label={`Maker ${i + 1}`} autoComplete="off" />
                </div>
                {count > 1 && (
                  <Button variant="outline-danger" className="mb-3" onClick={() => remove(i)}>
                    Remove<span className="visually-hidden"> maker {i + 1}</span>
                  </Button>
                )}
              </div>
            ))}
            {groupError && (
              <p id={errorId} className="text-danger fw-bold" data-testid="makers-error">
                {groupError}
              </p>
            )}
            {count < MAKERS_MAX ? (
              <Button
                variant="outline-primary"
                className="mb-3"
                onClick={() => {
                  focusLast.current = true;
                  push('');
                }}
              >
                Add another maker
              </Button>
            ) : (
              <p className="text-body-secondary">An entry can list at most {MAKERS_MAX} makers.</p>
            )}
          </div>
        )}
      </FieldArray>
    </fieldset>
  );
}

function StoryHelp({ length }: { length: number }) {
  const over = length - STORY_MAX;
  return (
    <span data-testid="story-count" className={over > 0 ? 'text-danger fw-bold' : undefined}>
      {over > 0 ? `${length} of ${STORY_MAX} characters: ${over} too many.` : `${length} of ${STORY_MAX} characters.`} The show chair
      keeps it with your entry, to read out or show beside your quilt.
    </span>
  );
}

/** Cancel leaves at once when nothing was typed; otherwise it asks first, as the typing would be lost. */
function CancelEntry({ href, editing }: { href: string; editing: boolean }) {
  const { dirty } = useFormikContext<EntryValues>();
  const navigate = useNavigate();
  if (!dirty)
    return (
      <Link to={href} className="btn btn-outline-secondary">
        Cancel
      </Link>
    );
  return (
    <ConfirmAction
      label="Cancel"
      question={`Leave without ${editing ? 'saving the changes' : 'entering this quilt'}? What you typed will be lost.`}
      confirmLabel="Yes, leave"
      cancelLabel="Keep typing"
      variant="outline-secondary"
      onConfirm={() => navigate(href)}
    />
  );
}

/** Enter a quilt, or change one that is still waiting for the show chair. */
export function EntryForm({ guildId, show, entry, makerName, members, onCreate, onUpdate, onSaved }: EntryFormProps) {
  const perimeterId = useId();
  const currency = show.currency;
  const editing = Boolean(entry);
  const initialValues = entry ? toEntryValues(entry, currency) : emptyEntryValues(makerName, show.categories);
  const categoryOptions = show.categories.map((c) => ({ value: String(c.id), label: c.name }));
  const memberOptions = [...(members ?? [])].sort((a, b) => a.name.localeCompare(b.name)).map((m) => ({ value: String(m.membershipId), label: m.name }));

  return (
    <Formik<EntryValues>
      initialValues={initialValues}
      validationSchema={entrySchema(currency, show.categories)}
      onSubmit={async (values, helpers) => {
        helpers.setStatus(undefined);
        try {
          const saved = entry ? await onUpdate(toEntryPatch(values, currency, entry)) : await onCreate(toEntryInput(values, currency));
          onSaved(saved);
        } catch (error) {
          applyServerErrors(error, helpers, values, ENTRY_FIELD_MAP);
        }
      }}
    >
      {({ values }) => {
        const category = show.categories.find((c) => String(c.id) === values.categoryId);
        return (
          <Form noValidate aria-label={editing ? 'Change the entry' : 'Enter a quilt'} className="entry-form">
            <FormAlert />
            {members && !editing && (
              <>
                <FollowEntrant members={members} makerName={makerName} />
                <SelectField
                  name="onBehalfOf"
                  label="Entering on behalf of"
                  options={memberOptions}
                  placeholder="Myself"
                  help="For a member who does not use Selvage. The quilt is entered in her name."
                />
              </>
            )}
            <SelectField
              name="categoryId"
              label="Category"
              options={categoryOptions}
              placeholder="Choose a category"
              help={
                category ? (
                  <span data-testid="category-rule">
                    {category.sizeRuleText}.{category.judged ? ' Judged.' : ' Exhibit only, not judged.'}
                    {category.minMakers != null && category.minMakers > 1 ? ` Made by at least ${category.minMakers} people.` : ''}
                  </span>
                ) : (
                  'Each category says which sizes it takes.'
                )
              }
            />
            <TextField name="title" label="Title of the quilt" autoComplete="off" />
            <Row xs={1} sm={2} className="g-0 gx-sm-3">
              <Col>
                <TextField
                  name="widthIn"
                  label="Width (inches)"
                  inputMode="decimal"
                  autoComplete="off"
                  help="Across the top, where the sleeve goes. Like 60, 60 1/2 or 60.5."
                  describedBy={perimeterId}
                />
              </Col>
              <Col>
                <TextField
                  name="heightIn"
                  label="Height (inches)"
                  inputMode="decimal"
                  autoComplete="off"
                  help="From the top edge to the bottom edge."
                  describedBy={perimeterId}
                />
              </Col>
            </Row>
            <SizePreview show={show} perimeterId={perimeterId} />
            <MakersField />
            <TextField
              name="quilter"
              label="Quilted by"
              optional
              autoComplete="off"
              help="If you quilted it yourself, type your own name. Leave empty if you do not know."
            />
            <TextField name="techniques" label="Techniques" optional autoComplete="off" help="For example: hand appliqué, machine quilted." />
            <TextareaField
              name="story"
              label="The story of your quilt"
              optional
              rows={5}
              help={<StoryHelp length={values.story.length} />}
            />
            <CheckboxField name="forSale" label="This quilt is for sale" />
            {values.forSale && (
              <TextField name="price" label={`Price (${currency})`} inputMode="decimal" autoComplete="off" help="Like 450 or 450.00." />
            )}
            <div className="d-flex flex-wrap gap-2 align-items-center">
              <SubmitButton busyLabel="Sending">{editing ? 'Save the changes' : 'Enter this quilt'}</SubmitButton>
              <CancelEntry href={showPaths.show.getHref(guildId, show.id)} editing={editing} />
            </div>
          </Form>
        );
      }}
    </Formik>
  );
}
