import { useId } from 'react';
import Button from 'react-bootstrap/Button';
import type { Ballot, BallotEntry } from '../api/types';
import { chooseOne, clearCategory, entryLabel, removeRanked, toggleApproval, toggleRanked, type Selection } from '../lib/choices';
import { entryNumberText, joinNames, ordinal } from '../lib/labels';

export type BallotShape = Pick<Ballot, 'categories'> & { show: Pick<Ballot['show'], 'votingKind' | 'rankDepth'> };

type BallotChoicesProps = {
  ballot: BallotShape;
  selection: Selection;
  onChange: (next: Selection) => void;
  /** Level of the headings inside (category names on a ranked ballot, "Your choices"). */
  headingLevel?: 2 | 3;
};

/** A quilt as the ballot shows it: photo, number, title, and makers unless they are hidden. */
function EntryFace({ entry }: { entry: BallotEntry }) {
  const number = entryNumberText(entry.entryNumber);
  return (
    <span className="ballot-face">
      {entry.photoUrl ? (
        <img src={entry.photoUrl} alt="" className="ballot-thumb" loading="lazy" />
      ) : (
        <span className="ballot-thumb is-empty" aria-hidden="true">
          No photo
        </span>
      )}
      <span className="ballot-text">
        {/* Spaces between the lines keep the words apart when the card is read out as one name. */}
        {number && <span className="ballot-number">{number}</span>}{' '}
        <span className="ballot-title">{entry.title}</span>{' '}
        {entry.makers && entry.makers.length > 0 && <span className="ballot-makers">by {joinNames(entry.makers)}</span>}
      </span>
    </span>
  );
}

function SingleOrMany({ ballot, selection, onChange }: BallotChoicesProps) {
  const id = useId();
  const many = ballot.show.votingKind === 'approval';
  return (
    <>
      {ballot.categories.map((category) => {
        const picked = selection.categories[String(category.id)] ?? [];
        const helpId = `${id}-${category.id}-help`;
        return (
          <fieldset key={category.id} className="ballot-category" aria-describedby={helpId} data-testid="ballot-category">
            <legend className="ballot-legend">{category.name}</legend>
            {category.description && <p className="mb-1">{category.description}</p>}
            <p id={helpId} className="form-text mt-0">
              {category.entries.length === 0 ? 'No quilts in this category.' : many ? 'Tick as many as you like, or none.' : 'Choose one quilt, or none.'}
            </p>
            <div className="ballot-cards">
              {category.entries.map((entry) => {
                const inputId = `${id}-${category.id}-${entry.id}`;
                const checked = picked.includes(entry.id);
                return (
                  <label key={entry.id} htmlFor={inputId} className={`ballot-card${checked ? ' is-chosen' : ''}`} data-testid="ballot-card">
                    <input
                      id={inputId}
                      type={many ? 'checkbox' : 'radio'}
                      className="form-check-input ballot-input"
                      name={`${id}-category-${category.id}`}
                      value={entry.id}
                      checked={checked}
                      onChange={(e) =>
                        onChange(
                          many
                            ? toggleApproval(selection, category.id, entry.id, e.currentTarget.checked)
                            : chooseOne(selection, category.id, entry.id),
                        )
                      }
                    />
                    <EntryFace entry={entry} />
                  </label>
                );
              })}
            </div>
            {!many && picked.length > 0 && (
              <Button variant="link" className="ballot-clear px-0" onClick={() => onChange(clearCategory(selection, category.id))}>
                No vote in {category.name}
              </Button>
            )}
          </fieldset>
        );
      })}
    </>
  );
}

function Ranked({ ballot, selection, onChange, headingLevel = 2 }: BallotChoicesProps) {
  const id = useId();
  const H = `h${headingLevel}` as 'h2';
  const depth = ballot.show.rankDepth;
  const entries = new Map(ballot.categories.flatMap((c) => c.entries.map((e) => [e.id, e] as const)));
  const count = selection.ranked.length;
  const full = count >= depth;
  const next =
    count === 0
      ? 'Tap your favourite quilt first.'
      : full
        ? `You have chosen all ${depth}. To change one, tap it again or press Remove.`
        : `Now tap your ${ordinal(count + 1)} choice, or check your ballot if you are done.`;

  return (
    <div className="ranked-ballot">
      <section className="ranked-summary" aria-labelledby={`${id}-summary`}>
        <H id={`${id}-summary`} className="h4 mb-2">
          Your choices
        </H>
        <ol className="plain-list mb-2">
          {Array.from({ length: depth }, (_, i) => {
            const entry = entries.get(selection.ranked[i]);
            return (
              <li key={i} className="ranked-place" data-testid="ranked-place">
                <span className="place-badge">{ordinal(i + 1)}</span>
                <span className="flex-grow-1 min-w-0 break-anywhere">{entry ? entryLabel(entry) : 'Not chosen yet'}</span>
                {entry && (
                  <Button variant="outline-danger" onClick={() => onChange(removeRanked(selection, entry.id))}>
                    Remove<span className="visually-hidden"> {entryLabel(entry)} from {ordinal(i + 1)} place</span>
                  </Button>
                )}
              </li>
            );
          })}
        </ol>
        {count > 0 && (
          <Button variant="outline-secondary" onClick={() => onChange({ ...selection, ranked: [] })}>
            Start again
          </Button>
        )}
      </section>
      <p role="status" aria-live="polite" className="ranked-next fw-bold">
        {next}
      </p>
      {ballot.categories.map((category) => (
        <section key={category.id} aria-labelledby={`${id}-cat-${category.id}`} className="ballot-category" data-testid="ballot-category">
          <H id={`${id}-cat-${category.id}`} className="ballot-legend">
            {category.name}
          </H>
          {category.entries.length === 0 && <p className="form-text">No quilts in this category.</p>}
          <ul className="plain-list ballot-cards">
            {category.entries.map((entry) => {
              const place = selection.ranked.indexOf(entry.id) + 1;
              return (
                <li key={entry.id}>
                  <button
                    type="button"
                    className={`ballot-card${place ? ' is-chosen' : ''}`}
                    aria-pressed={place > 0}
                    disabled={full && !place}
                    onClick={() => onChange(toggleRanked(selection, entry.id, depth))}
                    data-testid="ballot-card"
                  >
                    <span className={`place-badge${place ? '' : ' is-empty'}`}>{place ? `${ordinal(place)} choice` : 'Not chosen'}</span>{' '}
                    <EntryFace entry={entry} />
                  </button>
                </li>
              );
            })}
          </ul>
        </section>
      ))}
    </div>
  );
}

/**
 * The choice part of a ballot, the same for a member, a visitor and the desk keying in paper:
 * large radio cards per category, tick cards for approval, or tap-in-order places for ranked.
 */
export function BallotChoices(props: BallotChoicesProps) {
  return props.ballot.show.votingKind === 'ranked' ? <Ranked {...props} /> : <SingleOrMany {...props} />;
}

/** What to do, in one or two sentences, for each kind of ballot. */
export function ballotInstructions(ballot: BallotShape): string {
  switch (ballot.show.votingKind) {
    case 'approval':
      return 'In each category, tick every quilt you like. Tick as many as you want, or none.';
    case 'ranked': {
      const how = ballot.show.rankDepth === 3 ? 'three' : String(ballot.show.rankDepth);
      return `Pick your ${how} favourite quilts in the whole show: tap your favourite first, then your next favourite, and so on.`;
    }
    default:
      return 'Choose your favourite quilt in each category. You can leave a category out.';
  }
}
