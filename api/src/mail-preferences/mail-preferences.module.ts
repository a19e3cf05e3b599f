import { Module } from '@nestjs/common';
import { MailPreferencesController } from './mail-preferences.controller';

@Module({ controllers: [MailPreferencesController] })
export class MailPreferencesModule {}
