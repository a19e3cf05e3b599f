import { useId, useState } from 'react';
import Button from 'react-bootstrap/Button';
import Form from 'react-bootstrap/Form';
import Spinner from 'react-bootstrap/Spinner';
import { ErrorAlert } from '@/components/ui/error-alert';
import { payablePlans, type DuesPlan } from '../api/get-dues-plans';
import { hasCharge, type MyDues } from '../api/get-my-dues';
import { useStartCheckout } from '../api/start-checkout';
import { formatDay } from '../lib/format';
import { formatMoney } from '../lib/money';
import { usePaymentHandoff } from '../lib/use-payment-handoff';
import { QuoteLines } from './quote-lines';

type PayDuesProps = {
  guildId: string;
  dues: MyDues;
  plans: DuesPlan[];
  currency: string;
};

function firstChoice(dues: MyDues, choices: DuesPlan[]): number | null {
  if (dues.plan && choices.some((p) => p.id === dues.plan!.id)) return dues.plan.id;
  return choices.length === 1 ? choices[0].id : null;
}

/** What she owes for the plan she chooses, and the one button that takes her to pay it. */
export function PayDues({ guildId, dues, plans, currency }: PayDuesProps) {
  const choices = payablePlans(plans);
  const ownPlanId = dues.plan?.id ?? null;
  const [planId, setPlanId] = useState<number | null>(() => firstChoice(dues, choices));
  // The exact amount for the plan she picks; when the api has none, the payment page shows it.
  const exact =
    planId === null ? null : planId === ownPlanId && dues.quote ? dues.quote : (dues.quotes?.find((q) => q.planId === planId)?.quote ?? null);
  const otherPlan = planId !== null && exact === null;
  const chosen = choices.find((p) => p.id === planId) ?? null;
  const checkout = useStartCheckout(guildId);
  const handoff = usePaymentHandoff<number>((id, callbacks) => checkout.mutate(id, callbacks));
  const redirecting = handoff.redirecting;
  const legendId = useId();
  const coversId = useId();

  const quote = exact;
  const busy = checkout.isPending || redirecting;
  const explained = (otherPlan && chosen !== null) || Boolean(quote?.coversFrom && quote.coversThrough);
  // Paid up on her own plan: nothing to choose until renewal opens.
  const settled = Boolean(dues.quote && !hasCharge(dues.quote) && planId === ownPlanId);

  const pay = () => {
    if (planId !== null) handoff.start(planId);
  };

  return (
    <div data-testid="pay-dues">
      {choices.length > 1 && !settled && (
        <fieldset className="mb-3" aria-labelledby={legendId}>
          <legend id={legendId} className="form-label fs-6 fw-bold mb-1">
            Choose your plan
          </legend>
          {choices.map((plan) => (
            <Form.Check key={plan.id} id={`${legendId}-plan-${plan.id}`}>
              <Form.Check.Input
                type="radio"
                name="plan"
                value={plan.id}
                checked={planId === plan.id}
                disabled={busy}
                onChange={() => setPlanId(plan.id)}
              />
              <Form.Check.Label>
                {plan.name}: {formatMoney(plan.yearlyCents, currency)} a year
                {plan.id === ownPlanId && <span className="text-body-secondary"> (your plan)</span>}
                {(plan.minAge != null || plan.maxAge != null) && (
                  <span className="d-block small text-body-secondary">{ageText(plan)}</span>
                )}
              </Form.Check.Label>
            </Form.Check>
          ))}
        </fieldset>
      )}
      {(choices.length === 1 || settled) && planId !== null && (
        <p>
          Your plan: <strong>{chosen?.name ?? choices[0].name}</strong>
        </p>
      )}

      {planId === null && choices.length > 1 && <p>Choose a plan to see what you owe.</p>}
      {choices.length === 0 && <p>There is no plan to pay for yet. Please ask the guild treasurer.</p>}

      {!otherPlan && quote && !hasCharge(quote) && (
        <p className="fw-bold" data-testid="nothing-to-pay">
          {quote.note ?? 'You have nothing to pay right now.'}
        </p>
      )}

      {!otherPlan && quote && hasCharge(quote) && (
        <>
          <QuoteLines lines={quote.lines} totalCents={quote.totalCents} currency={quote.currency} caption="What you owe" totalLabel="To pay" />
          {quote.coversFrom && quote.coversThrough && (
            <p id={coversId}>
              This pays your dues from <strong>{formatDay(quote.coversFrom)}</strong> to <strong>{formatDay(quote.coversThrough)}</strong>.
            </p>
          )}
          {quote.note && <p>{quote.note}</p>}
        </>
      )}

      {otherPlan && chosen && (
        <p id={coversId}>
          {chosen.name} is {formatMoney(chosen.yearlyCents, currency)} a year. The payment page shows the exact amount before you pay: it
          can be less if you are joining part-way through the year.
        </p>
      )}

      {((!otherPlan && quote && hasCharge(quote)) || (otherPlan && chosen)) && (
        <>
          <ErrorAlert error={checkout.error} />
          <Button variant="primary" size="lg" className="pay-button" disabled={busy} aria-describedby={explained ? coversId : undefined} onClick={pay}>
            {busy ? (
              <>
                <Spinner animation="border" size="sm" aria-hidden="true" className="me-2" />
                Opening the payment page…
              </>
            ) : quote && !otherPlan ? (
              `Pay ${formatMoney(quote.totalCents, quote.currency)} by card`
            ) : (
              'Go to the card payment page'
            )}
          </Button>
          <p className="mt-2 text-body-secondary">
            You go to a secure card payment page. Nothing is charged until you press Pay there, and you come straight back here.
          </p>
        </>
      )}
    </div>
  );
}

function ageText(plan: DuesPlan): string {
  if (plan.minAge != null && plan.maxAge != null) return `For ages ${plan.minAge} to ${plan.maxAge}`;
  if (plan.minAge != null) return `For ages ${plan.minAge} and over`;
  return `For ages up to ${plan.maxAge}`;
}
