import { Module } from '@nestjs/common';
import { HousekeepingService } from './housekeeping.service';

@Module({ providers: [HousekeepingService] })
export class HousekeepingModule {}
