/**
 * Builders for the API objects the payments fake hands out. Each one is typed with the official
 * SDK's own interface and fills every required field (null where the fake has nothing to say), so
 * the type checker proves the shapes match what the SDK expects.
 */
import { randomBytes } from 'node:crypto';
import type Stripe from 'stripe';
import { processingFee } from './money';

const ALPHABET = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789';

/** `prefix` followed by `length` random letters and digits. */
export function newId(prefix: string, length = 24): string {
  const bytes = randomBytes(length * 2);
  let out = '';
  for (let i = 0; out.length < length && i < bytes.length; i++) {
    // 248 is the largest multiple of 62 below 256: dropping higher bytes keeps the choice unbiased.
    if (bytes[i] < 248) out += ALPHABET[bytes[i] % 62];
  }
  return out.length === length ? prefix + out : newId(prefix, length);
}

export const ID_PREFIX = {
  session: 'cs_test_',
  paymentIntent: 'pi_',
  charge: 'ch_',
  refund: 're_',
  balanceTransaction: 'txn_',
  event: 'evt_',
  request: 'req_',
  paymentMethod: 'pm_',
  lineItem: 'li_',
  price: 'price_',
  product: 'prod_',
} as const;

/** The events the fake sends. */
export type PaymentsEvent =
  | Stripe.CheckoutSessionCompletedEvent
  | Stripe.CheckoutSessionExpiredEvent
  | Stripe.PaymentIntentSucceededEvent
  | Stripe.PaymentIntentPaymentFailedEvent
  | Stripe.PaymentIntentCanceledEvent
  | Stripe.ChargeSucceededEvent
  | Stripe.ChargeFailedEvent
  | Stripe.ChargeRefundedEvent
  | Stripe.RefundCreatedEvent;

export type PaymentsEventType = PaymentsEvent['type'];

/** The object each event type carries. */
export type EventObject<T extends PaymentsEventType> = Extract<PaymentsEvent, { type: T }>['data']['object'];

export interface SessionRecord {
  /** Kept without `line_items`; `payment_intent` is an id or null. */
  session: Stripe.Checkout.Session;
  lineItems: Stripe.LineItem[];
  paymentIntentData: { metadata: Stripe.Metadata; description: string | null };
}

export interface LineItemInput {
  name: string;
  description: string | null;
  productMetadata: Stripe.Metadata;
  currency: string;
  unitAmount: number;
  quantity: number;
  metadata: Stripe.Metadata;
}

export interface SessionInput {
  created: number;
  expiresAt: number;
  currency: string;
  lineItems: LineItemInput[];
  successUrl: string | null;
  cancelUrl: string | null;
  customerEmail: string | null;
  clientReferenceId: string | null;
  metadata: Stripe.Metadata;
  paymentIntentMetadata: Stripe.Metadata;
  paymentIntentDescription: string | null;
  /** Base of the hosted checkout page, e.g. "http://127.0.0.1:12111". */
  publicUrl: string;
}

export function buildLineItem(input: LineItemInput, created: number): Stripe.LineItem {
  const total = input.unitAmount * input.quantity;
  const price: Stripe.Price = {
    id: newId(ID_PREFIX.price),
    object: 'price',
    active: false,
    billing_scheme: 'per_unit',
    created,
    currency: input.currency,
    custom_unit_amount: null,
    livemode: false,
    lookup_key: null,
    metadata: {},
    nickname: null,
    product: newId(ID_PREFIX.product, 14),
    recurring: null,
    tax_behavior: 'unspecified',
    tiers_mode: null,
    transform_quantity: null,
    type: 'one_time',
    unit_amount: input.unitAmount,
    unit_amount_decimal: null,
  };
  return {
    id: newId(ID_PREFIX.lineItem),
    object: 'item',
    adjustable_quantity: null,
    amount_discount: 0,
    amount_subtotal: total,
    amount_tax: 0,
    amount_total: total,
    currency: input.currency,
    description: input.name,
    metadata: input.metadata,
    price,
    quantity: input.quantity,
  };
}

export function buildSession(input: SessionInput): SessionRecord {
  const id = newId(ID_PREFIX.session, 58);
  const lineItems = input.lineItems.map((item) => buildLineItem(item, input.created));
  const total = lineItems.reduce((sum, item) => sum + item.amount_total, 0);
  const session: Stripe.Checkout.Session = {
    id,
    object: 'checkout.session',
    adaptive_pricing: null,
    after_expiration: null,
    allow_promotion_codes: null,
    allowed_payment_method_types: null,
    amount_subtotal: total,
    amount_total: total,
    automatic_tax: { enabled: false, liability: null, provider: null, status: null },
    billing_address_collection: null,
    cancel_url: input.cancelUrl,
    client_reference_id: input.clientReferenceId,
    client_secret: null,
    collected_information: null,
    consent: null,
    consent_collection: null,
    created: input.created,
    currency: input.currency,
    currency_conversion: null,
    custom_fields: [],
    custom_text: { after_submit: null, shipping_address: null, submit: null, terms_of_service_acceptance: null },
    customer: null,
    customer_account: null,
    customer_creation: 'if_required',
    customer_details: null,
    customer_email: input.customerEmail,
    discounts: [],
    expires_at: input.expiresAt,
    integration_identifier: null,
    invoice: null,
    invoice_creation: null,
    livemode: false,
    locale: null,
    managed_payments: null,
    metadata: input.metadata,
    mode: 'payment',
    origin_context: null,
    payment_intent: null,
    payment_link: null,
    payment_method_collection: 'if_required',
    payment_method_configuration_details: null,
    payment_method_options: {},
    payment_method_types: ['card'],
    payment_status: 'unpaid',
    permissions: null,
    recovered_from: null,
    saved_payment_method_options: null,
    setup_intent: null,
    shipping_address_collection: null,
    shipping_cost: null,
    shipping_options: [],
    status: 'open',
    submit_type: null,
    subscription: null,
    success_url: input.successUrl,
    total_details: { amount_discount: 0, amount_shipping: 0, amount_tax: 0 },
    ui_mode: 'hosted_page',
    url: `${input.publicUrl}/pay/${id}`,
    wallet_options: null,
  };
  return {
    session,
    lineItems,
    paymentIntentData: { metadata: input.paymentIntentMetadata, description: input.paymentIntentDescription },
  };
}

export function buildPaymentIntent(record: SessionRecord, created: number, receiptEmail: string | null): Stripe.PaymentIntent {
  const id = newId(ID_PREFIX.paymentIntent);
  return {
    id,
    object: 'payment_intent',
    allowed_payment_method_types: null,
    amount: record.session.amount_total ?? 0,
    amount_capturable: 0,
    amount_received: 0,
    application: null,
    application_fee_amount: null,
    automatic_payment_methods: null,
    canceled_at: null,
    cancellation_reason: null,
    capture_method: 'automatic_async',
    client_secret: `${id}_secret_${newId('', 25)}`,
    confirmation_method: 'automatic',
    created,
    currency: record.session.currency ?? 'usd',
    customer: null,
    customer_account: null,
    description: record.paymentIntentData.description,
    excluded_payment_method_types: null,
    last_payment_error: null,
    latest_charge: null,
    livemode: false,
    managed_payments: null,
    metadata: { ...record.paymentIntentData.metadata },
    next_action: null,
    on_behalf_of: null,
    payment_method: null,
    payment_method_configuration_details: null,
    payment_method_options: null,
    payment_method_types: ['card'],
    payment_record: null,
    processing: null,
    receipt_email: receiptEmail,
    review: null,
    setup_future_usage: null,
    shipping: null,
    source: null,
    statement_descriptor: null,
    statement_descriptor_suffix: null,
    status: 'requires_payment_method',
    transfer_data: null,
    transfer_group: null,
  };
}

/** What the issuer said about a test card. */
export type CardOutcome =
  | { kind: 'approved' }
  | { kind: 'declined'; declineCode: 'generic_decline' | 'insufficient_funds'; message: string; sellerMessage: string };

export interface TestCard {
  number: string;
  brand: string;
  outcome: CardOutcome;
}

export const TEST_CARDS: readonly TestCard[] = [
  { number: '4242424242424242', brand: 'visa', outcome: { kind: 'approved' } },
  {
    number: '4000000000000002',
    brand: 'visa',
    outcome: {
      kind: 'declined',
      declineCode: 'generic_decline',
      message: 'Your card was declined.',
      sellerMessage: 'The bank did not return any further details with this decline.',
    },
  },
  {
    number: '4000000000009995',
    brand: 'visa',
    outcome: {
      kind: 'declined',
      declineCode: 'insufficient_funds',
      message: 'Your card has insufficient funds.',
      sellerMessage: 'The bank returned the decline code `insufficient_funds`.',
    },
  },
];

/** The test card for what a person typed (spaces and dashes allowed), or null. */
export function findTestCard(typed: string): TestCard | null {
  const digits = typed.replace(/[\s-]/g, '');
  return TEST_CARDS.find((card) => card.number === digits) ?? null;
}

export interface ChargeInput {
  paymentIntent: Stripe.PaymentIntent;
  card: TestCard;
  created: number;
  email: string | null;
  statementDescriptor: string;
  balanceTransactionId: string | null;
  paymentMethodId: string;
}

export function buildCharge(input: ChargeInput): Stripe.Charge {
  const { paymentIntent: pi, card, created } = input;
  const approved = card.outcome.kind === 'approved';
  const outcome: Stripe.Charge.Outcome =
    card.outcome.kind === 'approved'
      ? {
          advice_code: null,
          network_advice_code: null,
          network_decline_code: null,
          network_status: 'approved_by_network',
          reason: null,
          risk_level: 'normal',
          seller_message: 'Payment complete.',
          type: 'authorized',
        }
      : {
          advice_code: card.outcome.declineCode === 'insufficient_funds' ? 'try_again_later' : 'do_not_try_again',
          network_advice_code: null,
          network_decline_code: null,
          network_status: 'declined_by_network',
          reason: card.outcome.declineCode,
          risk_level: 'normal',
          seller_message: card.outcome.sellerMessage,
          type: 'issuer_declined',
        };
  const expiry = new Date(created * 1000);
  return {
    id: newId(ID_PREFIX.charge),
    object: 'charge',
    amount: pi.amount,
    amount_captured: approved ? pi.amount : 0,
    amount_refunded: 0,
    application: null,
    application_fee: null,
    application_fee_amount: null,
    balance_transaction: input.balanceTransactionId,
    billing_details: { address: null, email: input.email, name: null, phone: null, tax_id: null },
    calculated_statement_descriptor: input.statementDescriptor,
    captured: approved,
    created,
    currency: pi.currency,
    customer: null,
    description: pi.description,
    disputed: false,
    failure_balance_transaction: null,
    failure_code: approved ? null : 'card_declined',
    failure_message: card.outcome.kind === 'approved' ? null : card.outcome.message,
    fraud_details: {},
    livemode: false,
    metadata: { ...pi.metadata },
    on_behalf_of: null,
    outcome,
    paid: approved,
    payment_intent: pi.id,
    payment_method: input.paymentMethodId,
    payment_method_details: {
      type: 'card',
      card: {
        amount_authorized: approved ? pi.amount : null,
        authorization_code: null,
        brand: card.brand,
        checks: { address_line1_check: null, address_postal_code_check: null, cvc_check: null },
        country: 'US',
        electronic_commerce_indicator: null,
        exp_month: 12,
        exp_year: expiry.getUTCFullYear() + 3,
        funding: 'credit',
        installments: null,
        last4: card.number.slice(-4),
        mandate: null,
        network: card.brand,
        network_transaction_id: null,
        regulated_status: 'unregulated',
        three_d_secure: null,
        transaction_link_id: null,
        wallet: null,
      },
    },
    receipt_email: null,
    receipt_number: null,
    receipt_url: null,
    refunded: false,
    review: null,
    shipping: null,
    source: null,
    source_transfer: null,
    statement_descriptor: null,
    statement_descriptor_suffix: null,
    status: approved ? 'succeeded' : 'failed',
    transfer_data: null,
    transfer_group: null,
  };
}

const DAY = 24 * 60 * 60;

/** The balance entry for a successful charge: the full amount in, less the processing fee. */
export function buildChargeTransaction(id: string, charge: Stripe.Charge): Stripe.BalanceTransaction {
  const fee = processingFee(charge.amount);
  return {
    id,
    object: 'balance_transaction',
    amount: charge.amount,
    available_on: charge.created + 2 * DAY,
    balance_type: 'payments',
    created: charge.created,
    currency: charge.currency,
    description: charge.description,
    exchange_rate: null,
    fee,
    fee_details: [{ amount: fee, application: null, currency: charge.currency, description: 'Processing fees', type: 'stripe_fee' }],
    net: charge.amount - fee,
    reporting_category: 'charge',
    source: charge.id,
    status: 'available',
    type: 'charge',
  };
}

/** The balance entry for a refund: the refunded amount out; the processing fee is not given back. */
export function buildRefundTransaction(id: string, refund: Stripe.Refund): Stripe.BalanceTransaction {
  return {
    id,
    object: 'balance_transaction',
    amount: -refund.amount,
    available_on: refund.created,
    balance_type: 'payments',
    created: refund.created,
    currency: refund.currency,
    description: 'REFUND FOR CHARGE',
    exchange_rate: null,
    fee: 0,
    fee_details: [],
    net: -refund.amount,
    reporting_category: 'refund',
    source: refund.id,
    status: 'available',
    type: 'refund',
  };
}

export interface RefundInput {
  charge: Stripe.Charge;
  amount: number;
  reason: Stripe.Refund.Reason | null;
  metadata: Stripe.Metadata;
  created: number;
  balanceTransactionId: string;
}

export function buildRefund(input: RefundInput): Stripe.Refund {
  return {
    id: newId(ID_PREFIX.refund),
    object: 'refund',
    amount: input.amount,
    balance_transaction: input.balanceTransactionId,
    charge: input.charge.id,
    created: input.created,
    currency: input.charge.currency,
    customer: null,
    customer_account: null,
    destination_details: { type: 'card', card: { reference_status: 'pending', reference_type: 'acquirer_reference_number', type: 'refund' } },
    metadata: input.metadata,
    payment_intent: typeof input.charge.payment_intent === 'string' ? input.charge.payment_intent : input.charge.payment_intent?.id ?? null,
    payment_method: input.charge.payment_method,
    reason: input.reason,
    receipt_number: null,
    source_transfer_reversal: null,
    status: 'succeeded',
    transfer_reversal: null,
  };
}

export interface EventInput<T extends PaymentsEventType> {
  type: T;
  object: EventObject<T>;
  created: number;
  apiVersion: string;
  pendingWebhooks: number;
  request: Stripe.Event.Request | null;
}

/** An event carrying a snapshot of `object` as it is now. */
export function buildEvent<T extends PaymentsEventType>(input: EventInput<T>): Extract<PaymentsEvent, { type: T }> {
  const event = {
    id: newId(ID_PREFIX.event),
    object: 'event',
    api_version: input.apiVersion,
    created: input.created,
    data: { object: structuredClone(input.object) },
    livemode: false,
    pending_webhooks: input.pendingWebhooks,
    request: input.request,
    type: input.type,
  } satisfies Omit<Stripe.Event, 'type' | 'data'> & { type: T; data: { object: EventObject<T> } };
  // `satisfies` above checks every field; TypeScript cannot narrow the union by a generic `type`.
  return event as unknown as Extract<PaymentsEvent, { type: T }>;
}
