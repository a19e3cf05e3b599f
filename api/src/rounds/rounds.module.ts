import { Module } from '@nestjs/common';
import { BeesModule } from '../bees/bees.module';
import { BeesScheduler } from './bees-scheduler.service';
import { RoundMailer } from './round-mailer.service';
import { RoundsController } from './rounds.controller';
import { RoundsService } from './rounds.service';

@Module({
  imports: [BeesModule],
  controllers: [RoundsController],
  providers: [RoundsService, RoundMailer, BeesScheduler],
  exports: [RoundMailer, BeesScheduler, RoundsService],
})
export class RoundsModule {}
