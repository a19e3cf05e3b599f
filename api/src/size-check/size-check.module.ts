import { Module } from '@nestjs/common';
import { RoundsModule } from '../rounds/rounds.module';
import { PhotoProcessor } from './photo-processor.service';
import { ReferenceCardController } from './reference-card.controller';
import { SizeChecksController } from './size-checks.controller';
import { SizeChecksService } from './size-checks.service';

@Module({
  imports: [RoundsModule],
  controllers: [SizeChecksController, ReferenceCardController],
  providers: [SizeChecksService, PhotoProcessor],
  exports: [PhotoProcessor],
})
export class SizeCheckModule {}
