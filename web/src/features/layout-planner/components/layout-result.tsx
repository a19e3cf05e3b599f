import Card from 'react-bootstrap/Card';
import Form from 'react-bootstrap/Form';
import { formatInches } from '@/lib/inches';
import type { Arrangement, BedFit, LayoutPlanResult, Length } from '../api/create-layout-plan';

/** Shows a length the api sent, whatever its shape, in inches. */
export function lengthText(value: Length): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return `${formatInches(value)} in`;
  if (typeof value === 'string') return /in|"|yd|yard/i.test(value) ? value : `${value} in`;
  if (value.text) return /in|"/.test(value.text) ? value.text : `${value.text} in`;
  if (typeof value.inches === 'number') return `${formatInches(value.inches)} in`;
  if (typeof value.mm === 'number') return `${formatInches(value.mm / 25.4)} in`;
  return '';
}

function pairText(width: Length, height: Length, widthText?: string, heightText?: string): string {
  if (widthText && heightText) return `${widthText} x ${heightText} in`;
  return `${lengthText(width).replace(/ in$/, '')} x ${lengthText(height)}`;
}

function yardageText(value: Length): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return `${formatInches(value)} yards`;
  if (typeof value === 'string') return /yd|yard/i.test(value) ? value : `${value} yards`;
  return lengthText(value);
}

function bedName(bed: BedFit): string {
  return bed.label ?? bed.name ?? bed.bed ?? 'Bed';
}

function dropText(value: Length): string {
  if (typeof value === 'number' && value < 0) return `${formatInches(-value)} in short`;
  return lengthText(value);
}

type LayoutResultProps = {
  result: LayoutPlanResult;
  onPick: (arrangement: Arrangement) => void;
  picking: boolean;
};

export function LayoutResult({ result, onPick, picking }: LayoutResultProps) {
  const { plan, arrangements, svg } = result;
  const top = pairText(plan.top.width, plan.top.height, plan.top.widthText, plan.top.heightText);
  const svgSrc = `data:image/svg+xml;utf8,${encodeURIComponent(svg)}`;
  const pieces = plan.sashingPieces ?? (plan.sashing && typeof plan.sashing === 'object' ? plan.sashing : null);
  const beds = plan.beds.filter((b) => b.covers !== false);
  return (
    <div className="layout-result">
      <section aria-labelledby="arrangement-heading" className="mb-4">
        <h2 id="arrangement-heading" className="h3">
          Arrangement
        </h2>
        <fieldset>
          <legend className="form-label fs-6 fw-bold mb-1">Rows and columns</legend>
          {arrangements.map((a) => {
            const id = `arrangement-${a.rows}x${a.columns}`;
            return (
              <Form.Check key={id} id={id}>
                <Form.Check.Input
                  type="radio"
                  name="arrangement"
                  checked={a.rows === plan.rows && a.columns === plan.columns}
                  disabled={picking}
                  onChange={() => onPick(a)}
                />
                <Form.Check.Label>
                  {a.rows} rows x {a.columns} columns: uses {a.used} {a.used === 1 ? 'block' : 'blocks'}
                  {a.leftover > 0 ? `, ${a.leftover} left over` : ', none left over'}
                </Form.Check.Label>
              </Form.Check>
            );
          })}
        </fieldset>
      </section>

      <figure className="layout-preview mb-4">
        <img src={svgSrc} alt={`Sketch of the quilt top: ${plan.rows} rows of ${plan.columns} blocks, ${top} finished.`} />
        <figcaption className="text-body-secondary mt-2">
          The quilt top, {plan.rows} rows x {plan.columns} columns, drawn to scale. Sizes are finished.
        </figcaption>
      </figure>

      <div className="row row-cols-1 row-cols-md-2 g-3">
        <div className="col">
          <Card as="section" aria-labelledby="top-heading" className="h-100">
            <Card.Body>
              <h3 id="top-heading" className="h4">
                Quilt top
              </h3>
              <p className="size-figure mb-2">
                <span className="size-label">Finished size</span> <strong className="size-value">{top}</strong>
              </p>
              {pieces && (
                <p className="mb-0">
                  Sashing to cut:{' '}
                  {pieces.description ?? (
                    <>
                      {pieces.strips} {pieces.strips === 1 ? 'strip' : 'strips'}
                      {pieces.cornerstones > 0 && ` and ${pieces.cornerstones} cornerstones`}.
                    </>
                  )}
                </p>
              )}
            </Card.Body>
          </Card>
        </div>
        <div className="col">
          <Card as="section" aria-labelledby="beds-heading" className="h-100">
            <Card.Body>
              <h3 id="beds-heading" className="h4">
                Beds it covers
              </h3>
              {beds.length === 0 ? (
                <p className="mb-0">It does not cover the top of a crib mattress: a wall hanging or a lap quilt.</p>
              ) : (
                <ul className="plain-list mb-0">
                  {beds.map((bed, i) => (
                    <li key={`${bedName(bed)}-${i}`} className="mb-2">
                      <strong>{bedName(bed)}</strong>
                      {(bed.sideDrop !== undefined || bed.footDrop !== undefined) && (
                        <span className="d-block">
                          {bed.sideDrop !== undefined && <>Side drop {dropText(bed.sideDrop)}</>}
                          {bed.sideDrop !== undefined && bed.footDrop !== undefined && ', '}
                          {bed.footDrop !== undefined && <>foot drop {dropText(bed.footDrop)}</>}
                        </span>
                      )}
                    </li>
                  ))}
                </ul>
              )}
              <p className="mb-0 mt-2 text-body-secondary small">Drops are measured from the mattress top, with no pillow tuck.</p>
            </Card.Body>
          </Card>
        </div>
        <div className="col">
          <Card as="section" aria-labelledby="binding-heading" className="h-100">
            <Card.Body>
              <h3 id="binding-heading" className="h4">
                Binding
              </h3>
              <dl className="facts mb-0">
                <div>
                  <dt>Length</dt>
                  <dd>{lengthText(plan.binding.length)}</dd>
                </div>
                <div>
                  <dt>Strips</dt>
                  <dd>{plan.binding.strips}, cut across the fabric</dd>
                </div>
                <div>
                  <dt>Fabric</dt>
                  <dd>{lengthText(plan.binding.fabric)} off the bolt</dd>
                </div>
              </dl>
            </Card.Body>
          </Card>
        </div>
        <div className="col">
          <Card as="section" aria-labelledby="backing-heading" className="h-100">
            <Card.Body>
              <h3 id="backing-heading" className="h4">
                Backing and batting
              </h3>
              <dl className="facts mb-0">
                <div>
                  <dt>Backing</dt>
                  <dd>{pairText(plan.backing.width, plan.backing.height)}</dd>
                </div>
                <div>
                  <dt>Backing pieces</dt>
                  <dd>
                    {plan.backing.pieces}
                    {plan.backing.pieces > 1 && plan.backing.seams && plan.backing.seams !== 'none' && `, seamed ${plan.backing.seams === 'vertical' ? 'top to bottom' : 'side to side'}`}
                    {plan.backing.pieceLength !== undefined && plan.backing.pieces > 0 && <>, each {lengthText(plan.backing.pieceLength)} long</>}
                  </dd>
                </div>
                <div>
                  <dt>Backing fabric</dt>
                  <dd>{yardageText(plan.backing.yardage)}</dd>
                </div>
                <div>
                  <dt>Batting</dt>
                  <dd>{pairText(plan.batting.width, plan.batting.height)}</dd>
                </div>
              </dl>
            </Card.Body>
          </Card>
        </div>
      </div>
    </div>
  );
}
