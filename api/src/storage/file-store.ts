import { Inject, Injectable } from '@nestjs/common';
import { randomBytes } from 'node:crypto';
import { mkdir, readFile, rm, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { appConfig, type AppConfig } from '../config/app.config';

/**
 * Where uploaded bytes live. Keys are random and chosen here, never by the uploader; the local-disk
 * store is the default and an S3-compatible store can take its place behind the same methods.
 */
export abstract class FileStore {
  abstract put(bytes: Buffer): Promise<string>;
  abstract get(key: string): Promise<Buffer>;
  abstract delete(key: string): Promise<void>;
}

const KEY = /^[a-f0-9]{32}$/;

@Injectable()
export class LocalDiskFileStore extends FileStore {
  constructor(@Inject(appConfig.KEY) private readonly app: AppConfig) {
    super();
  }

  private pathOf(key: string): string {
    if (!KEY.test(key)) throw new Error('invalid storage key');
    // Two levels of fan-out keep any one folder small.
    return join(this.app.uploadsDir, key.slice(0, 2), key);
  }

  async put(bytes: Buffer): Promise<string> {
    const key = randomBytes(16).toString('hex');
    const path = this.pathOf(key);
    await mkdir(join(this.app.uploadsDir, key.slice(0, 2)), { recursive: true });
    await writeFile(path, bytes, { flag: 'wx' });
    return key;
  }

  get(key: string): Promise<Buffer> {
    return readFile(this.pathOf(key));
  }

  async delete(key: string): Promise<void> {
    await rm(this.pathOf(key), { force: true });
  }
}
