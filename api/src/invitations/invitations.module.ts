import { Module } from '@nestjs/common';
import { GuildInvitationsController, InvitationLinksController } from './invitations.controller';
import { InvitationsService } from './invitations.service';

@Module({
  controllers: [GuildInvitationsController, InvitationLinksController],
  providers: [InvitationsService],
})
export class InvitationsModule {}
