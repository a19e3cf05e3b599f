import { Inject, Injectable, Logger, ServiceUnavailableException, ConflictException, HttpException } from '@nestjs/common';
import Stripe from 'stripe';
import { paymentsConfig, type PaymentsConfig } from '../config/app.config';

const UNAVAILABLE = 'The card-payment service did not answer, so nothing was charged or changed. Please try again in a minute.';

/** The SDK client for the configured service: the local fake when PAYMENTS_API_URL is set, else the real one. */
export function createPaymentsClient(cfg: PaymentsConfig): Stripe | null {
  if (!cfg.secretKey) return null;
  if (cfg.apiUrl) {
    const url = new URL(cfg.apiUrl);
    const protocol = url.protocol === 'https:' ? 'https' : 'http';
    return new Stripe(cfg.secretKey, {
      host: url.hostname,
      port: Number(url.port || (protocol === 'https' ? 443 : 80)),
      protocol,
      maxNetworkRetries: 0,
      timeout: 15_000,
    });
  }
  // Every POST we make carries our own idempotency key, so the SDK's retries cannot charge twice.
  return new Stripe(cfg.secretKey, { maxNetworkRetries: 2, timeout: 20_000 });
}

/** A provider error as an answer a person can act on (never a 500). */
export function providerError(e: unknown, doing: string): HttpException {
  if (e instanceof HttpException) return e;
  if (e instanceof Stripe.errors.StripeAuthenticationError || e instanceof Stripe.errors.StripePermissionError)
    return new ServiceUnavailableException(
      'Online payment is not set up correctly on this server (the payment service refused our key). Please tell the guild treasurer.',
    );
  if (e instanceof Stripe.errors.StripeInvalidRequestError || e instanceof Stripe.errors.StripeCardError) {
    if (e.code === 'resource_missing')
      return new ConflictException(`The payment service has no record of this payment, so it cannot ${doing}. Record it by hand instead.`);
    return new ConflictException(`The payment service refused to ${doing}: ${e.message}`);
  }
  if (e instanceof Stripe.errors.StripeIdempotencyError)
    return new ConflictException(`The payment service is still busy with the same request. Wait a moment and try again.`);
  return new ServiceUnavailableException(UNAVAILABLE);
}

type ExpandedSession = Stripe.Checkout.Session;

/**
 * Everything the dues module asks of the card-payment service, through the official SDK. Each POST
 * carries an idempotency key derived from our own ids, so a retry never makes a second session
 * or refund.
 */
@Injectable()
export class PaymentsGateway {
  private readonly logger = new Logger(PaymentsGateway.name);
  readonly client: Stripe | null;

  constructor(@Inject(paymentsConfig.KEY) private readonly cfg: PaymentsConfig) {
    this.client = createPaymentsClient(cfg);
  }

  get enabled(): boolean {
    return this.client !== null;
  }

  private sdk(): Stripe {
    if (!this.client)
      throw new ServiceUnavailableException('Online card payment is not set up for this server. Please pay the treasurer by cash or cheque.');
    return this.client;
  }

  async createSession(params: Stripe.Checkout.SessionCreateParams, idempotencyKey: string): Promise<Stripe.Checkout.Session> {
    try {
      return await this.sdk().checkout.sessions.create(params, { idempotencyKey });
    } catch (e) {
      this.logger.warn(`checkout session ${idempotencyKey}: ${(e as Error).message}`);
      throw providerError(e, 'start the payment');
    }
  }

  /** The session with its payment, charge and balance transaction (for the fee and net). */
  async retrieveSession(id: string): Promise<ExpandedSession> {
    try {
      return await this.sdk().checkout.sessions.retrieve(id, { expand: ['payment_intent.latest_charge.balance_transaction'] });
    } catch (e) {
      throw providerError(e, 'look up the payment');
    }
  }

  /** Expires an open session; returns false when the service says it is no longer open. */
  async expireSession(id: string, idempotencyKey: string): Promise<boolean> {
    try {
      await this.sdk().checkout.sessions.expire(id, {}, { idempotencyKey });
      return true;
    } catch (e) {
      if (e instanceof Stripe.errors.StripeInvalidRequestError && e.statusCode === 400) return false;
      throw providerError(e, 'cancel the payment page');
    }
  }

  async createRefund(params: Stripe.RefundCreateParams, idempotencyKey: string): Promise<Stripe.Refund> {
    try {
      return await this.sdk().refunds.create(params, { idempotencyKey });
    } catch (e) {
      this.logger.warn(`refund ${idempotencyKey}: ${(e as Error).message}`);
      throw providerError(e, 'make the refund');
    }
  }

  async listRefunds(paymentIntentId: string): Promise<Stripe.Refund[]> {
    try {
      const out: Stripe.Refund[] = [];
      for await (const r of this.sdk().refunds.list({ payment_intent: paymentIntentId, limit: 100 })) out.push(r);
      return out;
    } catch (e) {
      throw providerError(e, 'list the refunds');
    }
  }

  /** Verifies the signature on the raw body; throws StripeSignatureVerificationError when it fails. */
  verifyEvent(rawBody: Buffer, signature: string): Stripe.Event {
    if (!this.cfg.webhookSecret)
      throw new ServiceUnavailableException('Payment events are not set up on this server (no webhook signing secret).');
    return Stripe.webhooks.constructEvent(rawBody, signature, this.cfg.webhookSecret);
  }
}
