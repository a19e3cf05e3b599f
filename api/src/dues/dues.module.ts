import { Module } from '@nestjs/common';
import { DuesLedgerService } from './dues-ledger.service';
import { DuesController } from './dues.controller';
import { DuesReportService } from './dues-report.service';
import { DuesService } from './dues.service';
import { PaymentsGateway } from './payments-gateway';
import { PaymentsWebhookController } from './payments-webhook.controller';

@Module({
  controllers: [DuesController, PaymentsWebhookController],
  providers: [DuesService, DuesLedgerService, DuesReportService, PaymentsGateway],
  exports: [DuesService, DuesLedgerService, PaymentsGateway],
})
export class DuesModule {}
