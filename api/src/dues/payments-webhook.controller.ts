import { Controller, Headers, HttpCode, Post, Req, type RawBodyRequest } from '@nestjs/common';
import { ApiExcludeController } from '@nestjs/swagger';
import type { Request } from 'express';
import { Public } from '../common/decorators/public.decorator';
import { SkipOriginCheck } from '../common/decorators/skip-origin-check.decorator';
import { DuesLedgerService } from './dues-ledger.service';

/**
 * Events from the card-payment service. No session and no browser origin: the signature on the raw
 * body is the only credential (checked before anything is read or written).
 */
@ApiExcludeController()
@Controller('payments')
export class PaymentsWebhookController {
  constructor(private readonly ledger: DuesLedgerService) {}

  @Public()
  @SkipOriginCheck()
  @Post('webhook')
  @HttpCode(200)
  receive(@Req() req: RawBodyRequest<Request>, @Headers('stripe-signature') signature?: string) {
    return this.ledger.receiveEvent(req.rawBody, signature);
  }
}
