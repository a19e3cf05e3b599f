import { Global, Module } from '@nestjs/common';
import { FileStore, LocalDiskFileStore } from './file-store';

@Global()
@Module({ providers: [{ provide: FileStore, useClass: LocalDiskFileStore }], exports: [FileStore] })
export class StorageModule {}
