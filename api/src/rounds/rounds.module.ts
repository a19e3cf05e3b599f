import { Module } from '@nestjs/common';
import { BeesModule } from '../bees/bees.module';
import { BeeScheduleController, BeeScheduleService } from './bee-schedule.controller';
import { BeesScheduler } from './bees-scheduler.service';
import { RoundMailer } from './round-mailer.service';
import { RoundsController } from './rounds.controller';
import { RoundsService } from './rounds.service';

@Module({
  imports: [BeesModule],
  controllers: [RoundsController, BeeScheduleController],
  providers: [RoundsService, RoundMailer, BeesScheduler, BeeScheduleService],
  exports: [RoundMailer, BeesScheduler, RoundsService],
})
export class RoundsModule {}
