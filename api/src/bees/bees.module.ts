import { Module } from '@nestjs/common';
import { BeesController } from './bees.controller';
import { BeesService } from './bees.service';

@Module({ controllers: [BeesController], providers: [BeesService], exports: [BeesService] })
export class BeesModule {}
