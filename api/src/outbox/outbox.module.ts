import { Global, Module } from '@nestjs/common';
import { OutboxService } from './outbox.service';
import { OutboxWorker } from './outbox.worker';

@Global()
@Module({ providers: [OutboxService, OutboxWorker], exports: [OutboxService, OutboxWorker] })
export class OutboxModule {}
