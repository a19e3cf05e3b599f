import { Module } from '@nestjs/common';
import { GuildsController, NewGuildController } from './guilds.controller';
import { GuildsService } from './guilds.service';
import { MembersController } from './members.controller';
import { MembersService } from './members.service';

@Module({ controllers: [NewGuildController, GuildsController, MembersController], providers: [GuildsService, MembersService] })
export class GuildsModule {}
