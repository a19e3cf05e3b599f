import { Module } from '@nestjs/common';
import { InvitationsService } from '../invitations/invitations.service';
import { RosterImportController } from './roster-import.controller';
import { RosterImportService } from './roster-import.service';

@Module({
  controllers: [RosterImportController],
  // The invitations the import sends go through the same service (and outbox) as any other.
  providers: [RosterImportService, InvitationsService],
})
export class RosterImportModule {}
