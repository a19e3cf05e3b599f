import { Module } from '@nestjs/common';
import { StorageModule } from '../storage/storage.module';
import { DeparturesController } from './departures.controller';
import { DeparturesService } from './departures.service';

@Module({ imports: [StorageModule], controllers: [DeparturesController], providers: [DeparturesService] })
export class DeparturesModule {}
