import 'reflect-metadata';
import { NestFactory } from '@nestjs/core';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { Logger } from 'nestjs-pino';
import { AppModule } from './app.module';
import { configureApp } from './configure-app';

async function bootstrap() {
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
  // Config errors are already a readable list; print them without a stack.
  console.error(e instanceof Error ? e.message : e);
  process.exit(1);
});
