import { Module } from '@nestjs/common';
import { SizeCheckModule } from '../size-check/size-check.module';
import { StorageModule } from '../storage/storage.module';
import { ShowEntriesService } from './show-entries.service';
import { ShowPrintsService } from './show-prints.service';
import { ShowsController } from './shows.controller';
import { ShowsService } from './shows.service';
import { PublicBallotController, VotingController } from './voting.controller';
import { VotingService } from './voting.service';

@Module({
  imports: [StorageModule, SizeCheckModule],
  controllers: [ShowsController, VotingController, PublicBallotController],
  providers: [ShowsService, ShowEntriesService, VotingService, ShowPrintsService],
})
export class ShowsModule {}
