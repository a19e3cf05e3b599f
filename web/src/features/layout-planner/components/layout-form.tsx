import { FieldArray, Form, Formik } from 'formik';
import Button from 'react-bootstrap/Button';
import { CheckboxField, TextField } from '@/components/ui/form-fields';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import { layoutPlanDefaults, layoutPlanSchema, type LayoutPlanValues } from '../api/create-layout-plan';

const MAX_BORDERS = 6;

export function LayoutForm({ onPlan }: { onPlan: (values: LayoutPlanValues) => Promise<unknown> }) {
  return (
    <Formik
      initialValues={layoutPlanDefaults}
      validationSchema={layoutPlanSchema}
      onSubmit={async (values, helpers) => {
        helpers.setStatus(undefined);
        try {
          await onPlan(values);
        } catch (error) {
          applyServerErrors(error, helpers, values);
        }
      }}
    >
      {({ values }) => (
        <Form noValidate aria-label="Plan a quilt top">
          <FormAlert />
          <fieldset className="form-section">
            <legend className="h4">Blocks</legend>
            <TextField name="blockCount" type="number" inputMode="numeric" min={1} step={1} label="Number of blocks" />
            <div className="row g-3">
              <div className="col-12 col-sm-6">
                <TextField name="blockWidth" label="Block width, finished (inches)" autoComplete="off" help="For example 12 or 12 1/2" />
              </div>
              <div className="col-12 col-sm-6">
                <TextField name="blockHeight" label="Block height, finished (inches)" autoComplete="off" />
              </div>
            </div>
          </fieldset>
          <fieldset className="form-section">
            <legend className="h4">Sashing</legend>
            <TextField
              name="sashing"
              label="Sashing width, finished (inches)"
              optional
              autoComplete="off"
              help="The strips between blocks. Leave empty for blocks sewn straight together."
            />
            {values.sashing.trim() !== '' && (
              <>
                <CheckboxField name="sashingAround" label="Sashing around every block (also along the outer edge)" />
                <CheckboxField name="cornerstones" label="Cornerstones where the strips cross" />
              </>
            )}
          </fieldset>
          <fieldset className="form-section">
            <legend className="h4">Borders</legend>
            <FieldArray name="borders">
              {(helpers) => (
                <>
                  {values.borders.length === 0 && <p className="text-body-secondary">No borders.</p>}
                  <ol className="plain-list">
                    {values.borders.map((_, index) => (
                      <li key={index} className="d-flex flex-wrap align-items-end column-gap-3">
                        <div className="flex-grow-1">
                          <TextField
                            name={`borders.${index}`}
                            label={`Border ${index + 1} width, finished (inches)`}
                            autoComplete="off"
                            help={index === 0 ? 'Border 1 is the one next to the blocks.' : undefined}
                          />
                        </div>
                        <Button variant="outline-danger" className="mb-3" onClick={() => helpers.remove(index)}>
                          Remove<span className="visually-hidden"> border {index + 1}</span>
                        </Button>
                      </li>
                    ))}
                  </ol>
                  <Button
                    variant="outline-primary"
                    className="mb-3"
                    disabled={values.borders.length >= MAX_BORDERS}
                    onClick={() => helpers.push('')}
                  >
                    Add a border
                  </Button>
                </>
              )}
            </FieldArray>
          </fieldset>
          <fieldset className="form-section">
            <legend className="h4">Finishing</legend>
            <div className="row g-3">
              <div className="col-12 col-sm-6">
                <TextField name="bindingWidth" label="Binding strip width, cut (inches)" autoComplete="off" help="2 1/2 is usual." />
              </div>
              <div className="col-12 col-sm-6">
                <TextField name="fabricWidth" label="Usable fabric width (inches)" autoComplete="off" help="About 40 for quilting cotton." />
              </div>
              <div className="col-12 col-sm-6">
                <TextField name="backingMargin" label="Backing extra on each side (inches)" autoComplete="off" help="Ask your quilter; 4 is common." />
              </div>
              <div className="col-12 col-sm-6">
                <TextField name="battingMargin" label="Batting extra on each side (inches)" autoComplete="off" />
              </div>
            </div>
          </fieldset>
          <SubmitButton busyLabel="Working it out">Plan the quilt</SubmitButton>
        </Form>
      )}
    </Formik>
  );
}
