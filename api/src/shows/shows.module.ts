import { Module } from '@nestjs/common';
import { DuesModule } from '../dues/dues.module';
import { SizeCheckModule } from '../size-check/size-check.module';
import { StorageModule } from '../storage/storage.module';
import { BallotDefinitions } from './ballot-definitions';
import { ShowEntriesService } from './show-entries.service';
import { ShowFeesService } from './show-fees.service';
import { ShowPrintsService } from './show-prints.service';
import { ShowsController } from './shows.controller';
import { ShowsService } from './shows.service';
import { PublicBallotController, VotingController } from './voting.controller';
import { VotingService } from './voting.service';

@Module({
  imports: [StorageModule, SizeCheckModule, DuesModule],
  controllers: [ShowsController, VotingController, PublicBallotController],
  providers: [
    ShowsService,
    ShowEntriesService,
    VotingService,
    ShowPrintsService,
    ShowFeesService,
    { provide: BallotDefinitions, useFactory: () => new BallotDefinitions() },
  ],
})
export class ShowsModule {}
