import 'reflect-metadata';
import { NestFactory } from '@nestjs/core';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { Logger } from 'nestjs-pino';
import { validateEnv } from './config/env.validation';

async function bootstrap() {
  // Checked before the modules load, so a misconfigured server prints only the list of problems.
  validateEnv(process.env);
  const { AppModule } = await import('./app.module');
  const { configureApp } = await import('./configure-app');
  const app = await NestFactory.create<NestExpressApplication>(AppModule, { bufferLogs: true, rawBody: true });
  app.useLogger(app.get(Logger));
  const { closeSessionStore } = configureApp(app);
  const port = Number(process.env.PORT ?? 3000);
  await app.listen(port, '127.0.0.1');
  app.get(Logger).log(`Selvage is listening on http://127.0.0.1:${port}`);
  const stop = async () => {
    await app.close();
    await closeSessionStore();
    process.exit(0);
  };
  process.once('SIGINT', stop);
  process.once('SIGTERM', stop);
}

bootstrap().catch((e: unknown) => {
  console.error(e instanceof Error ? e.message : e);
  process.exit(1);
});
