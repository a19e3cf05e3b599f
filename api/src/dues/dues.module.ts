import { Module } from '@nestjs/common';
import { DuesLedgerService } from './dues-ledger.service';
import { DuesController } from './dues.controller';
import { DuesReportService } from './dues-report.service';
import { DuesRemindersService } from './dues-reminders.service';
import { DuesService } from './dues.service';
import { PaymentsGateway } from './payments-gateway';
import { PaymentsWebhookController } from './payments-webhook.controller';

@Module({
  controllers: [DuesController, PaymentsWebhookController],
  providers: [DuesService, DuesLedgerService, DuesReportService, DuesRemindersService, PaymentsGateway],
  exports: [DuesService, DuesLedgerService, PaymentsGateway],
})
export class DuesModule {}
