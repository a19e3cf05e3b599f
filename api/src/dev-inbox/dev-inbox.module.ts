import { Module } from '@nestjs/common';
import { DevInboxController } from './dev-inbox.controller';

@Module({ controllers: [DevInboxController] })
export class DevInboxModule {}
