import Button from 'react-bootstrap/Button';
import Card from 'react-bootstrap/Card';
import type { Office, Term } from '../api/get-offices';
import { describeTerm, formatDay } from '../lib/format';

type OfficeListProps = {
  offices: Office[];
  today: string;
  canEdit: boolean;
  onEditTerm: (term: Term) => void;
};

/** Each office with who holds it today, until when, and who takes it on next. */
export function OfficeList({ offices, today, canEdit, onEditTerm }: OfficeListProps) {
  return (
    <ul className="list-unstyled row row-cols-1 row-cols-md-2 g-3" aria-label="Offices">
      {offices.map((office) => (
        <li key={office.role} className="col" data-testid="office-card">
          <Card className="h-100">
            <Card.Body>
              <h3 className="h4 mb-2">{office.label}</h3>
              {office.holders.length === 0 && <p className="mb-2 text-body-secondary">Nobody holds this office today.</p>}
              {office.holders.map((term) => (
                <div key={term.id} className="mb-3" data-testid="office-holder">
                  <p className="mb-1 fs-5">
                    <strong>{term.name}</strong>, {describeTerm(term, today)}
                  </p>
                  {term.note && <p className="mb-1 text-body-secondary">{term.note}</p>}
                  {canEdit && (
                    <Button variant="outline-primary" onClick={() => onEditTerm(term)}>
                      Set term dates<span className="visually-hidden"> for {term.name} as {office.label}</span>
                    </Button>
                  )}
                </div>
              ))}
              {office.upcoming.length > 0 && (
                <>
                  <h4 className="h6 mt-3 mb-1">Coming up</h4>
                  <ul className="mb-0 ps-3">
                    {office.upcoming.map((term) => (
                      <li key={term.id} className="mb-2" data-testid="office-upcoming">
                        {term.name} takes over on {formatDay(term.startsOn)}
                        {term.endsOn ? `; access ends on ${formatDay(term.endsOn)}` : ''}
                        {canEdit && (
                          <Button variant="link" className="tap-link p-0 ms-2 align-baseline" onClick={() => onEditTerm(term)}>
                            Set term dates<span className="visually-hidden"> for {term.name} as {office.label}</span>
                          </Button>
                        )}
                      </li>
                    ))}
                  </ul>
                </>
              )}
            </Card.Body>
          </Card>
        </li>
      ))}
    </ul>
  );
}
