import type { NestExpressApplication } from '@nestjs/platform-express';
import { ConfigService } from '@nestjs/config';
import { DocumentBuilder, SwaggerModule } from '@nestjs/swagger';
import express, { type NextFunction, type Request, type Response } from 'express';
import session from 'express-session';
import MySQLStoreFactory from 'express-mysql-session';
import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import passport from 'passport';
import { sessionExpired } from './auth/session-limits';
import { createValidationPipe } from './common/pipes/validation';
import type { AppConfig } from './config/app.config';
import { ROSTER_IMPORT_ROUTES, rosterImportJsonParser } from './roster-import/roster-upload';

export const SESSION_COOKIE = 'selvage.sid';

/** Everything main.ts and the e2e tests share: sessions, passport, validation, docs, the web app. */
export function configureApp(app: NestExpressApplication): { closeSessionStore: () => Promise<void> } {
  const config = app.get(ConfigService);
  const appCfg = config.getOrThrow<AppConfig>('app');
  const secure = appCfg.origin.startsWith('https:');
  if (appCfg.trustProxy) app.set('trust proxy', 1);
  app.disable('x-powered-by');
  app.setGlobalPrefix('api');
  app.useGlobalPipes(createValidationPipe());
  app.enableShutdownHooks();
  // The roster import takes up to 5 MB of text as JSON; every other route keeps the default JSON limit.
  app.use(ROSTER_IMPORT_ROUTES, rosterImportJsonParser());

  const MySQLStore = MySQLStoreFactory(session as never);
  const store = new MySQLStore({
    host: config.getOrThrow('DB_HOST'),
    port: Number(config.getOrThrow('DB_PORT')),
    user: config.getOrThrow('DB_USER'),
    password: config.get('DB_PASSWORD') ?? '',
    database: config.getOrThrow('DB_NAME'),
    createDatabaseTable: false,
    clearExpired: true,
    checkExpirationInterval: 15 * 60 * 1000,
    connectionLimit: 5,
    schema: { tableName: 'sessions', columnNames: { session_id: 'session_id', expires: 'expires', data: 'data' } },
  } as never);

  app.use(
    session({
      name: SESSION_COOKIE,
      secret: appCfg.sessionSecret,
      store: store as never,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      cookie: { httpOnly: true, sameSite: 'lax', secure, path: '/' },
    }),
  );
  app.use((req: Request, _res: Response, next: NextFunction) => {
    const s = req.session as (typeof req.session & { passport?: { user?: unknown } }) | undefined;
    if (!s?.passport?.user) return next();
    const now = Date.now();
    if (sessionExpired(s, now)) return s.regenerate((err) => next(err));
    if (now - (s.lastSeenAt ?? 0) > 60_000) s.lastSeenAt = now;
    next();
  });
  app.use(passport.initialize());
  app.use(passport.session());

  const doc = SwaggerModule.createDocument(
    app,
    new DocumentBuilder()
      .setTitle('Selvage API')
      .setDescription('The hub a quilt guild and its bees run on. Cookie sessions; writes need a same-origin request.')
      .setVersion('0.1.0')
      .addCookieAuth(SESSION_COOKIE)
      .build(),
  );
  SwaggerModule.setup('api/docs', app, doc);

  serveWebApp(app, appCfg.webDistDir);
  return {
    closeSessionStore: () => new Promise<void>((r) => (store as unknown as { close: (cb: () => void) => void }).close(() => r())),
  };
}

/** Serves the built single-page app; any non-API GET falls back to its index.html. */
function serveWebApp(app: NestExpressApplication, dir: string): void {
  if (!dir) return;
  const root = resolve(dir);
  const index = join(root, 'index.html');
  if (!existsSync(index)) throw new Error(`WEB_DIST_DIR has no index.html: build the web app first (npm run build).`);
  app.use(
    express.static(root, {
      index: false,
      setHeaders: (res, path) => {
        if (path.includes(`${join(root, 'assets')}`)) res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
      },
    }),
  );
  app.use((req: Request, res: Response, next: NextFunction) => {
    if ((req.method === 'GET' || req.method === 'HEAD') && !req.path.startsWith('/api')) {
      res.setHeader('Cache-Control', 'no-cache');
      return res.sendFile(index);
    }
    next();
  });
}
