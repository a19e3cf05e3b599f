import { formatDate, formatDateTime } from '@/lib/dates';
import type { Round, RoundPage } from '../api/get-round';
import { RoundFiles } from './round-files';
import { SizePair, sizeText } from './size-preview';

/** "1/4" → "1/4 in"; texts that already name the unit stay as they are. */
const inchText = (text: string) => (/in|"/.test(text) ? text : `${text} in`);

type RoundDetailsProps = {
  guildId: string;
  beeId: string;
  page: RoundPage;
  round: Round;
  timeZone?: string;
  /** Only the bee's members see where blocks go (the api leaves it out for others). */
  isBeeMember: boolean;
};

function Swatches({ round }: { round: Round }) {
  if (round.swatches.length === 0 && !round.background) return <p className="mb-0">Any colours you like.</p>;
  return (
    <>
      {round.swatches.length > 0 && (
        <ul className="plain-list swatch-list" aria-label="Colours to use">
          {round.swatches.map((s, i) => (
            <li key={`${s.hex}-${i}`}>
              <span className="swatch-square" style={{ backgroundColor: s.hex }} aria-hidden="true" />
              <span>
                {s.name} <span className="text-body-secondary small">{s.hex.toUpperCase()}</span>
              </span>
            </li>
          ))}
        </ul>
      )}
      {round.background && (
        <p className="mb-0 mt-2 d-flex align-items-center gap-2">
          <span className="swatch-square" style={{ backgroundColor: round.background.hex }} aria-hidden="true" />
          <span>
            Background: {round.background.name}{' '}
            <span className="text-body-secondary small">{round.background.hex.toUpperCase()}</span>
          </span>
        </p>
      )}
    </>
  );
}

export function RoundDetails({ guildId, beeId, page, round, timeZone, isBeeMember }: RoundDetailsProps) {
  const sendAt = round.sendAt ?? page.sendAt ?? page.defaultSendAt;
  const untrimmed = round.trimMode === 'untrimmed';
  return (
    <div className="round-details">
      <SizePair finished={sizeText(round.finished)} unfinished={sizeText(round.unfinished)} />
      <dl className="facts facts-wide mt-3">
        <div>
          <dt>Seam allowance</dt>
          <dd>{inchText(round.seamAllowanceText)}</dd>
        </div>
        <div>
          <dt>Tolerance</dt>
          <dd>within {inchText(round.toleranceText)} of the unfinished size</dd>
        </div>
        <div>
          <dt>Trimming</dt>
          <dd>
            {untrimmed
              ? `Leave it untrimmed. The queen trims it to ${sizeText(round.unfinished)} unfinished.`
              : `Trim it to ${sizeText(round.unfinished)} unfinished.`}
          </dd>
        </div>
        <div>
          <dt>Fabric</dt>
          <dd>{round.fabricSource === 'queen_sends' ? 'The queen sends you fabric.' : 'Use fabric from your own stash.'}</dd>
        </div>
        <div>
          <dt>Colours</dt>
          <dd>
            <Swatches round={round} />
          </dd>
        </div>
        <div>
          <dt>Due date</dt>
          <dd>{formatDate(round.dueDate)}</dd>
        </div>
        <div>
          <dt>{round.sentAt ? 'E-mailed to the makers' : 'E-mail to the makers'}</dt>
          <dd>
            {round.sentAt
              ? formatDateTime(round.sentAt, timeZone)
              : round.status === 'published'
                ? formatDateTime(sendAt, timeZone)
                : `${formatDateTime(sendAt, timeZone)}, once the queen publishes the round`}
          </dd>
        </div>
        <div>
          <dt>Hand-over</dt>
          <dd>
            {round.deliveryMethod === 'mail' ? 'By mail' : 'At a meeting'}
            {isBeeMember && round.deliveryMethod === 'mail' && round.deliveryAddress && (
              <span className="d-block pre-wrap mt-1">
                <span className="visually-hidden">Mail to: </span>
                {round.deliveryAddress}
              </span>
            )}
            {isBeeMember && round.deliveryMethod === 'meeting' && round.meetingDetails && (
              <span className="d-block pre-wrap mt-1">{round.meetingDetails}</span>
            )}
            {!isBeeMember && <span className="d-block text-body-secondary">The bee's makers see where to send it.</span>}
          </dd>
        </div>
      </dl>
      <h3 className="h4 mt-4">Instructions</h3>
      {round.instructionsHtml ? (
        // The api renders the Markdown and sanitises the HTML.
        <div className="round-instructions" dangerouslySetInnerHTML={{ __html: round.instructionsHtml }} />
      ) : (
        <p>No written instructions.</p>
      )}
      {(round.patternLink || round.files.length > 0) && (
        <>
          <h3 className="h4 mt-4">Pattern</h3>
          {round.patternLink && (
            <p>
              <a href={round.patternLink} target="_blank" rel="noopener noreferrer" className="tap-link break-anywhere">
                Open the pattern<span className="visually-hidden"> (opens in a new tab)</span>
              </a>
            </p>
          )}
          <RoundFiles guildId={guildId} beeId={beeId} month={page.month} files={round.files} canEdit={false} />
        </>
      )}
    </div>
  );
}
