import { Module } from '@nestjs/common';
import { ProfileController } from './profile.controller';
import { DataExportService } from './data-export.service';
import { ProfileService } from './profile.service';

@Module({ controllers: [ProfileController], providers: [ProfileService, DataExportService] })
export class ProfileModule {}
