import { Module } from '@nestjs/common';
import { GuildsController, NewGuildController } from './guilds.controller';
import { GuildsService } from './guilds.service';

@Module({ controllers: [NewGuildController, GuildsController], providers: [GuildsService] })
export class GuildsModule {}
