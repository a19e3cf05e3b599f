/**
 * The hosted checkout page of the payments fake: plain server-rendered HTML, no script, large text,
 * one column that fits a 390 px phone, every input labelled and every error announced.
 */
import type Stripe from 'stripe';
import { formatAmount } from './money';
import { TEST_CARDS, type SessionRecord } from './objects';

export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

const STYLE = `
  *, *::before, *::after { box-sizing: border-box; }
  html { font-size: 125%; }
  body { margin: 0; background: #FBF7EF; color: #1E2430; font-family: system-ui, -apple-system, "Segoe UI", sans-serif; line-height: 1.5; }
  main { max-width: 34rem; margin: 0 auto; padding: 1rem; }
  h1 { font-size: 1.5rem; margin: 0.5rem 0 1rem; line-height: 1.25; }
  .test-mode { margin: 0; background: #1E2430; color: #FBF7EF; padding: 0.5rem 1rem; font-weight: 700; text-align: center; }
  table { width: 100%; border-collapse: collapse; margin-bottom: 1.5rem; }
  caption { text-align: left; font-weight: 700; padding-bottom: 0.5rem; }
  th, td { padding: 0.5rem 0; border-bottom: 1px solid #D9D1C3; vertical-align: top; text-align: left; }
  td.amount, th.amount { text-align: right; white-space: nowrap; padding-left: 1rem; }
  tfoot th, tfoot td { border-bottom: none; font-weight: 700; font-size: 1.15rem; }
  label { display: block; font-weight: 700; margin-bottom: 0.25rem; }
  input { display: block; width: 100%; font: inherit; padding: 0.6rem 0.75rem; min-height: 2.75rem; border: 2px solid #1E2430; border-radius: 0.375rem; background: #fff; color: #1E2430; }
  input:focus, button:focus, a:focus { outline: 3px solid #C99A2E; outline-offset: 2px; }
  input[aria-invalid="true"] { border-color: #A63D2F; }
  .field { margin-bottom: 1.25rem; }
  .hint { margin: 0.25rem 0 0; font-size: 0.9rem; font-weight: 400; }
  .error { border-left: 0.4rem solid #A63D2F; background: #fff; padding: 0.75rem 1rem; margin-bottom: 1.25rem; font-weight: 700; }
  .notice { border-left: 0.4rem solid #1D5C63; background: #fff; padding: 0.75rem 1rem; margin-bottom: 1.25rem; }
  button { display: block; width: 100%; font: inherit; font-weight: 700; min-height: 3rem; padding: 0.6rem 1rem; border: none; border-radius: 0.375rem; background: #1D5C63; color: #fff; cursor: pointer; }
  .back { display: inline-block; margin-top: 1.25rem; padding: 0.5rem 0; min-height: 2.75rem; color: #1D5C63; font-weight: 700; }
  ul { padding-left: 1.25rem; }
  .nowrap { white-space: nowrap; }
`;

function layout(title: string, body: string): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="robots" content="noindex">
<title>${escapeHtml(title)}</title>
<style>${STYLE}</style>
</head>
<body>
<header><p class="test-mode">Test payment: no real money moves</p></header>
<main>
${body}
</main>
</body>
</html>
`;
}

function formatCard(number: string): string {
  return number.replace(/(\d{4})(?=\d)/g, '$1 ');
}

function lineItemsTable(record: SessionRecord): string {
  const session = record.session;
  const currency = session.currency ?? 'usd';
  const rows = record.lineItems
    .map((item: Stripe.LineItem) => {
      const qty = item.quantity ?? 1;
      const unit = item.price?.unit_amount ?? 0;
      const each = qty > 1 ? ` <span class="hint">(${qty} × ${escapeHtml(formatAmount(unit, currency))})</span>` : '';
      return `<tr><th scope="row">${escapeHtml(item.description ?? '')}${each}</th><td class="amount">${escapeHtml(
        formatAmount(item.amount_total, currency),
      )}</td></tr>`;
    })
    .join('\n');
  return `<table>
<caption>What you are paying for</caption>
<thead><tr><th scope="col">Item</th><th scope="col" class="amount">Amount</th></tr></thead>
<tbody>
${rows}
</tbody>
<tfoot><tr><th scope="row">Total</th><td class="amount" id="total">${escapeHtml(formatAmount(session.amount_total ?? 0, currency))}</td></tr></tfoot>
</table>`;
}

export interface CheckoutPageInput {
  record: SessionRecord;
  merchantName: string;
  /** A problem with the last attempt, shown above the form and tied to the card field. */
  error?: string | null;
  /** What the person typed last time, so they need not type it again. */
  card?: string;
  email?: string;
}

/** The page for an open session: what is being paid for, the total, a card field and a Pay button. */
export function renderCheckoutPage(input: CheckoutPageInput): string {
  const { record, merchantName } = input;
  const session = record.session;
  const total = formatAmount(session.amount_total ?? 0, session.currency ?? 'usd');
  const error = input.error ? `<div class="error" role="alert" id="card-error">${escapeHtml(input.error)}</div>` : '';
  const describedBy = input.error ? 'card-error card-hint' : 'card-hint';
  const emailField = session.customer_email
    ? `<p>The receipt goes to <strong>${escapeHtml(session.customer_email)}</strong>.</p>`
    : `<div class="field">
<label for="email">Email for the receipt (optional)</label>
<input id="email" name="email" type="email" autocomplete="email" value="${escapeHtml(input.email ?? '')}">
</div>`;
  const testCards = TEST_CARDS.map((card) => {
    const what = card.outcome.kind === 'approved' ? 'pays' : `is declined (${card.outcome.declineCode.replace(/_/g, ' ')})`;
    return `<li><span class="nowrap">${formatCard(card.number)}</span> ${what}</li>`;
  }).join('');
  const cancel = session.cancel_url
    ? `<a class="back" href="${escapeHtml(session.cancel_url)}">Cancel and go back</a>`
    : '';
  return layout(
    `Pay ${merchantName}`,
    `<h1>Pay ${escapeHtml(merchantName)}</h1>
${lineItemsTable(record)}
${error}
<form method="post" action="/pay/${escapeHtml(session.id)}" novalidate>
${emailField}
<div class="field">
<label for="card">Card number</label>
<input id="card" name="card" type="text" inputmode="numeric" autocomplete="cc-number" required
  aria-describedby="${describedBy}"${input.error ? ' aria-invalid="true"' : ''} value="${escapeHtml(input.card ?? '')}">
<div class="hint" id="card-hint">Test cards (spaces are fine):<ul>${testCards}</ul></div>
</div>
<button type="submit">Pay ${escapeHtml(total)}</button>
</form>
${cancel}`,
  );
}

/** A page with a heading, a message and an optional link onward. */
export function renderMessagePage(title: string, message: string, link?: { href: string; text: string }): string {
  const onward = link ? `<a class="back" href="${escapeHtml(link.href)}">${escapeHtml(link.text)}</a>` : '';
  return layout(title, `<h1>${escapeHtml(title)}</h1>\n<p class="notice" role="status">${escapeHtml(message)}</p>\n${onward}`);
}
