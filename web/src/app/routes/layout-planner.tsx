import { useRef, useState } from 'react';
import Col from 'react-bootstrap/Col';
import Row from 'react-bootstrap/Row';
import { ErrorAlert } from '@/components/ui/error-alert';
import { usePageTitle } from '@/components/ui/page-title';
import {
  toLayoutPlanInput,
  useCreateLayoutPlan,
  type LayoutPlanResult,
  type LayoutPlanValues,
} from '@/features/layout-planner/api/create-layout-plan';
import { LayoutForm } from '@/features/layout-planner/components/layout-form';
import { LayoutResult } from '@/features/layout-planner/components/layout-result';

export default function LayoutPlannerRoute() {
  usePageTitle('Layout planner');
  const create = useCreateLayoutPlan();
  const [result, setResult] = useState<LayoutPlanResult | null>(null);
  const [values, setValues] = useState<LayoutPlanValues | null>(null);
  const [announcement, setAnnouncement] = useState('');
  const resultsRef = useRef<HTMLElement>(null);

  const plan = async (next: LayoutPlanValues, pick?: { rows: number; columns: number }) => {
    setAnnouncement('');
    const answer = await create.mutateAsync(toLayoutPlanInput(next, pick));
    setValues(next);
    setResult(answer);
    setAnnouncement(`Planned: ${answer.plan.rows} rows x ${answer.plan.columns} columns. The results are below the form.`);
    return answer;
  };

  return (
    <>
      <div className="page-header">
        <h1>Layout planner</h1>
        <p className="lead mb-0">
          Turn a pile of blocks into a quilt top: how to lay them out, how big it comes out, and how much binding, backing and
          batting to buy. All sizes are finished unless a label says cut.
        </p>
      </div>
      <Row className="g-4">
        <Col lg={5}>
          <section aria-labelledby="planner-form-heading">
            <h2 id="planner-form-heading" className="h3 mb-3">
              Your quilt
            </h2>
            <LayoutForm onPlan={(v) => plan(v)} />
          </section>
        </Col>
        <Col lg={7}>
          <section aria-labelledby="planner-results-heading" ref={resultsRef} tabIndex={-1}>
            <h2 id="planner-results-heading" className="h3 mb-3">
              Results
            </h2>
            <p role="status" aria-live="polite" className={announcement ? 'mb-3' : 'visually-hidden'}>
              {announcement}
            </p>
            {result ? (
              <>
                {create.isError && <ErrorAlert error={create.error} />}
                <LayoutResult
                  result={result}
                  picking={create.isPending}
                  onPick={(a) => {
                    if (values) void plan(values, a).catch(() => undefined);
                  }}
                />
              </>
            ) : (
              <p>Fill in the form and press “Plan the quilt”.</p>
            )}
          </section>
        </Col>
      </Row>
    </>
  );
}
