import { formatDateTime } from '@/lib/dates';
import type { SizeCheck } from '../api/get-size-checks';
import { checkedSizeText, CheckBadges, verdictWords, ToneIcon } from './verdict';

type HeadingLevel = 3 | 4 | 5;

/** What to do when a photo could not be measured, whatever the reason. */
export const RETAKE_ADVICE = [
  'Lay the block and the printed card flat, side by side, on the same table or floor.',
  'Hold the phone straight above them, so the whole block and all four black squares on the card are in the picture.',
  'Use a plain background that is darker or lighter than the block, in even light without shadows.',
];

/** The one line a maker needs: her photo's verdict, or that it could not be measured. */
export function resultAnnouncement(check: SizeCheck): string {
  if (check.status === 'failed') return `Selvage could not measure the photo. ${check.message ?? ''}`.trim();
  const words = verdictWords(check);
  return [`${words.label}.`, check.summary ?? ''].join(' ').trim();
}

type SizeCheckResultProps = {
  check: SizeCheck;
  headingLevel?: HeadingLevel;
  /** Whose block, when the organiser is looking on a maker's behalf. */
  makerName?: string;
  timeZone?: string;
};

/** A check in full: the marked-up photo, the sizes (each saying unfinished) and the verdict in words. */
export function SizeCheckResult({ check, headingLevel = 4, makerName, timeZone }: SizeCheckResultProps) {
  const H = `h${headingLevel}` as 'h4';
  const picture = check.images.overlay ?? check.images.display;
  const measured = checkedSizeText(check.measured);
  const manual = checkedSizeText(check.manual);
  const words = verdictWords(check);
  const whose = makerName ? `${makerName}'s block` : 'your block';
  const failed = check.status === 'failed';
  return (
    <section className="size-result" aria-label="Size check result" data-testid="size-check-result">
      <H className="h5 mb-2">{failed ? 'Selvage could not measure this photo' : 'What Selvage found'}</H>
      {(check.verdict || failed) && (
        <div className={`verdict-box tone-${words.tone} mb-3`}>
          {!failed && (
            <p className="verdict-headline mb-1">
              <ToneIcon tone={words.tone} />
              <strong>{words.label}</strong>
            </p>
          )}
          {check.outOfSquare && (
            <p className="verdict-headline tone-warn mb-1">
              <ToneIcon tone="warn" />
              <strong>Out of square</strong>
            </p>
          )}
          {failed ? (
            <>
              {check.message && <p className="mb-2">{check.message}</p>}
              <p className="mb-1 fw-bold">Take the photo again:</p>
              <ul className="mb-1">
                {RETAKE_ADVICE.map((tip) => (
                  <li key={tip}>{tip}</li>
                ))}
              </ul>
              <p className="mb-0">Or type what your ruler says below.</p>
            </>
          ) : (
            check.summary && <p className="mb-0">{check.summary}</p>
          )}
        </div>
      )}

      {(measured || manual) && (
        <dl className="facts facts-wide">
          {measured && (
            <div>
              <dt>From the photo</dt>
              <dd>
                <strong>{measured} inches</strong> unfinished (as it is now)
              </dd>
            </div>
          )}
          {manual && (
            <div>
              <dt>{makerName ? 'Typed from a ruler' : 'Your ruler'}</dt>
              <dd>
                <strong>{manual} inches</strong> unfinished (as it is now)
              </dd>
            </div>
          )}
          {measured && manual && (
            <div>
              <dt>Which counts</dt>
              <dd>The photo decides the verdict; the ruler figures are kept beside it for the queen.</dd>
            </div>
          )}
        </dl>
      )}

      {picture && (
        <figure className="size-photo mb-3">
          <a href={picture} target="_blank" rel="noopener noreferrer" className="d-inline-block">
            <img
              src={picture}
              alt={
                check.images.overlay
                  ? `Photo of ${whose} with the edges Selvage measured drawn on it (opens full size in a new tab)`
                  : `Photo of ${whose} (opens full size in a new tab)`
              }
            />
          </a>
          <figcaption className="text-body-secondary">
            {check.images.overlay ? 'The lines show the edges Selvage measured. ' : ''}
            Tap the picture to see it full size.
          </figcaption>
        </figure>
      )}

      <p className="text-body-secondary mb-0">
        {check.onBehalf ? 'Checked by the organiser on her behalf' : 'Checked'}
        {check.createdAt ? ` on ${formatDateTime(check.createdAt, timeZone)}` : ''}.
      </p>
    </section>
  );
}

/** The latest check in a few words for the queen's grid: badge, size and a thumbnail. */
export function SizeCheckSummary({ check, makerName }: { check: SizeCheck | null | undefined; makerName: string }) {
  if (!check) return <p className="mb-1 text-body-secondary">No size check yet.</p>;
  const measured = checkedSizeText(check.measured);
  const manual = checkedSizeText(check.manual);
  const full = check.images.overlay ?? check.images.display;
  const thumb = check.images.thumb ?? check.images.display;
  return (
    <div className="size-summary d-flex gap-3 align-items-start mb-1" data-testid="size-check-summary">
      {full && thumb && (
        <a href={full} target="_blank" rel="noopener noreferrer" className="size-thumb flex-shrink-0">
          <img src={thumb} alt={`Size check photo of ${makerName}'s block (opens full size in a new tab)`} width={72} height={72} />
        </a>
      )}
      <div className="min-w-0">
        <p className="mb-1">
          <span className="visually-hidden">Size check: </span>
          <CheckBadges check={check} />
        </p>
        {measured && <p className="mb-0">Photo: {measured} in unfinished</p>}
        {manual && <p className="mb-0">Ruler: {manual} in unfinished</p>}
        {check.status === 'failed' && !manual && <p className="mb-0">The photo could not be measured.</p>}
      </div>
    </div>
  );
}
