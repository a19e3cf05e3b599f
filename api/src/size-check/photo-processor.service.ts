import { Injectable, OnModuleDestroy } from '@nestjs/common';
import { availableParallelism } from 'node:os';
import { extname, join } from 'node:path';
import Piscina from 'piscina';
import type { PhotoOutput, PhotoTask, ResizeOutput, ResizeTask } from './photo.worker';

/**
 * A small pool of worker threads for photos. From compiled code the worker is plain JS; under the
 * test runner (TypeScript sources) the worker registers ts-node first.
 */
@Injectable()
export class PhotoProcessor implements OnModuleDestroy {
  private readonly pool: Piscina;

  constructor() {
    const ext = extname(__filename);
    this.pool = new Piscina({
      filename: join(__dirname, `photo.worker${ext}`),
      minThreads: 0,
      // One core stays with the event loop, so other requests stay quick while photos are measured.
      maxThreads: Math.max(1, availableParallelism() - 1),
      idleTimeout: 60_000,
      execArgv: ext === '.ts' ? ['-r', 'ts-node/register/transpile-only'] : [],
      resourceLimits: { maxOldGenerationSizeMb: 1536 },
    });
  }

  async process(task: PhotoTask): Promise<PhotoOutput> {
    return this.pool.run(task, { transferList: [task.bytes.buffer as ArrayBuffer] });
  }

  /** Display and thumbnail images of a photo that is shown but not measured. */
  async resize(task: ResizeTask): Promise<ResizeOutput> {
    return this.pool.run(task, { name: 'resizePhoto', transferList: [task.bytes.buffer as ArrayBuffer] });
  }

  async onModuleDestroy(): Promise<void> {
    await this.pool.destroy();
  }
}
