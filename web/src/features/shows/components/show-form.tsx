import { Form, Formik } from 'formik';
import Col from 'react-bootstrap/Col';
import Row from 'react-bootstrap/Row';
import { RadioGroupField, TextareaField, TextField } from '@/components/ui/form-fields';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import type { Show } from '../api/types';
import { RANKED_METHOD_OPTIONS, VOTING_KIND_OPTIONS } from '../lib/labels';
import {
  isVotingLocked,
  NEW_SHOW_VALUES,
  sendsOpeningTime,
  SHOW_FIELD_MAP,
  showSchema,
  toShowInput,
  toShowValues,
  type ShowInput,
  type ShowValues,
} from '../lib/show-form';
import { SwitchField } from './switch-field';

type ShowFormProps = {
  /** The show to change; a new show when absent. */
  show?: Show | null;
  currency: string;
  /** The guild's time zone: the schedule boxes are on its clocks. */
  timeZone?: string;
  onSave: (input: ShowInput) => Promise<Show>;
  onSaved?: (show: Show) => void;
};

/** Everything about a show but its categories: dates, entries, fees, the sleeve rule and viewer's choice voting. */
export function ShowForm({ show, currency, timeZone, onSave, onSaved }: ShowFormProps) {
  const create = !show;
  const locked = isVotingLocked(show);
  return (
    <Formik<ShowValues>
      initialValues={show ? toShowValues(show, timeZone) : NEW_SHOW_VALUES}
      validationSchema={showSchema(currency, { checkOpening: sendsOpeningTime(create, show?.votingState), timeZone })}
      onSubmit={async (values, helpers) => {
        helpers.setStatus(undefined);
        try {
          const saved = await onSave(toShowInput(values, currency, { create, votingLocked: locked, votingState: show?.votingState, timeZone }));
          if (!create) helpers.setStatus({ success: 'The show is saved.' });
          onSaved?.(saved);
        } catch (error) {
          applyServerErrors(error, helpers, values, SHOW_FIELD_MAP);
        }
      }}
    >
      {({ values }) => (
        <Form noValidate aria-label={create ? 'New show' : 'Show settings'} className="show-form">
          <FormAlert />
          <fieldset className="form-section">
            <legend className="h5">The show</legend>
            <TextField name="name" label="Name of the show" autoComplete="off" />
            <TextField name="venue" label="Where" autoComplete="off" help="The hall or building, and the town." />
            <TextareaField name="description" label="About the show" optional rows={4} help="Opening times, parking, anything visitors and entrants should know." />
            <Row xs={1} sm={2} className="g-0 gx-sm-3">
              <Col>
                <TextField name="startsOn" type="date" label="First day" />
              </Col>
              <Col>
                <TextField name="endsOn" type="date" label="Last day" />
              </Col>
            </Row>
          </fieldset>

          <fieldset className="form-section">
            <legend className="h5">Entries</legend>
            <Row xs={1} sm={2} className="g-0 gx-sm-3">
              <Col>
                <TextField name="entriesOpenOn" type="date" label="Entries open" optional />
              </Col>
              <Col>
                <TextField
                  name="entriesCloseOn"
                  type="date"
                  label="Entries close"
                  optional
                  help="The last day members can enter. It must be on or before the show's last day."
                />
              </Col>
            </Row>
            <TextField
              name="maxEntriesPerMember"
              type="number"
              inputMode="numeric"
              min={1}
              max={50}
              label="Most quilts one member may enter"
              optional
              help="1 to 50. Leave empty for no limit."
            />
            <Row xs={1} sm={2} className="g-0 gx-sm-3">
              <Col>
                <TextField
                  name="entryFee"
                  label={`Entry fee per quilt (${currency})`}
                  inputMode="decimal"
                  autoComplete="off"
                  optional
                  help="Leave empty if entering is free."
                />
              </Col>
              <Col>
                <TextField
                  name="entryFeeCap"
                  label={`Most one member pays in all (${currency})`}
                  inputMode="decimal"
                  autoComplete="off"
                  optional
                  help="Leave empty for no cap."
                />
              </Col>
            </Row>
          </fieldset>

          <fieldset className="form-section">
            <legend className="h5">Hanging sleeve</legend>
            <p className="text-body-secondary">Selvage tells each entrant what strip to cut for her quilt from these.</p>
            <TextField name="sleeveDepthIn" label="Sleeve depth (inches)" inputMode="decimal" autoComplete="off" help="Usually 4." />
            <Row xs={1} sm={2} className="g-0 gx-sm-3">
              <Col>
                <TextField
                  name="narrowUnderIn"
                  label="Narrow quilts: under this width (inches)"
                  inputMode="decimal"
                  autoComplete="off"
                  optional
                  help="Usually 30. Leave empty if every quilt uses the same sleeve."
                />
              </Col>
              <Col>
                <TextField name="narrowDepthIn" label="Narrow quilts: sleeve depth (inches)" inputMode="decimal" autoComplete="off" optional help="Usually 3." />
              </Col>
            </Row>
            <TextField
              name="splitOverIn"
              label="Split the sleeve for quilts wider than (inches)"
              inputMode="decimal"
              autoComplete="off"
              optional
              help="Usually 90: wide quilts hang from two sleeves with a gap in the middle."
            />
          </fieldset>

          <fieldset className="form-section">
            <legend className="h5">Viewer’s choice voting</legend>
            {locked && (
              <p id="voting-locked-note" className="locked-note" data-testid="voting-locked">
                How people vote cannot be changed now that voting has opened: ballots already cast were made this way.
              </p>
            )}
            {/* A disabled fieldset disables every radio in it. */}
            <fieldset disabled={locked} aria-describedby={locked ? 'voting-locked-note' : undefined} className="voting-choice">
              <RadioGroupField name="votingKind" legend="How people vote" options={VOTING_KIND_OPTIONS} />
              {values.votingKind === 'ranked' && (
                <>
                  <TextField
                    name="rankDepth"
                    type="number"
                    inputMode="numeric"
                    min={2}
                    max={5}
                    label="Places on a ranked ballot"
                    help="How many quilts each voter puts in order: 2 to 5. Usually 3. With 3/2/1 points, places after the 3rd score nothing."
                  />
                  <RadioGroupField name="rankedMethod" legend="How ranked ballots are counted" options={RANKED_METHOD_OPTIONS} />
                </>
              )}
            </fieldset>
            {!create && (
              <>
                <p className="mb-2">
                  Open and close voting by hand on the ballot desk, or set times here and Selvage does it.
                  {timeZone && <> Times are in the guild’s time zone ({timeZone}).</>}
                </p>
                {/* TextField hands its type to the input; its list of types just does not name datetime-local. */}
                {show?.votingState === 'closed' && <p className="locked-note">Voting has closed, and closing is final: these times can no longer change.</p>}
                {show?.votingState === 'open' && <p className="locked-note">Voting is open: only the closing time can change.</p>}
                <Row xs={1} sm={2} className="g-0 gx-sm-3">
                  <Col>
                    <fieldset disabled={show?.votingState === 'open' || show?.votingState === 'closed'}>
                      <TextField name="votingOpensAt" type={'datetime-local' as 'text'} label="Voting opens" optional />
                    </fieldset>
                  </Col>
                  <Col>
                    <fieldset disabled={show?.votingState === 'closed'}>
                      <TextField name="votingClosesAt" type={'datetime-local' as 'text'} label="Voting closes" optional />
                    </fieldset>
                  </Col>
                </Row>
              </>
            )}
          </fieldset>

          {!create && <MakersHiddenField />}

          <SubmitButton busyLabel="Saving">{create ? 'Create the show' : 'Save the show'}</SubmitButton>
        </Form>
      )}
    </Formik>
  );
}

function MakersHiddenField() {
  return (
    <fieldset className="form-section">
      <legend className="h5">Judging</legend>
      <SwitchField
        name="makersHidden"
        label="Makers hidden until judging is done"
        help="While this is on, hang tags, ballots and public pages leave out who made each quilt. Turn it off when the judges have finished."
      />
    </fieldset>
  );
}
