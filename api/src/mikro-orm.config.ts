import { defineConfig } from '@mikro-orm/mariadb';
import { Migrator } from '@mikro-orm/migrations';
import { SeedManager } from '@mikro-orm/seeder';
import { join } from 'node:path';
import { ENTITIES } from './entities';

/** One configuration for the app, the CLI (`npx mikro-orm …` in api/) and the tests. */
export default defineConfig({
  host: process.env.DB_HOST ?? '127.0.0.1',
  port: Number(process.env.DB_PORT ?? 3407),
  dbName: process.env.DB_NAME ?? 'selvage',
  user: process.env.DB_USER ?? 'selvage',
  password: process.env.DB_PASSWORD ?? '',
  entities: ENTITIES,
  extensions: [Migrator, SeedManager],
  timezone: '+00:00',
  forceUtcTimezone: true,
  // A couple of connections kept open: a burst of requests on a cold api otherwise waits on new sockets.
  pool: { min: 2, max: 10 },
  debug: false,
  allowGlobalContext: false,
  migrations: {
    path: join(__dirname, 'database', 'migrations'),
    pathTs: join(__dirname, 'database', 'migrations'),
    glob: '!(*.d).{js,ts}',
    transactional: true,
    allOrNothing: true,
    snapshot: false,
    emit: 'ts',
  },
  seeder: {
    path: join(__dirname, 'database', 'seeders'),
    pathTs: join(__dirname, 'database', 'seeders'),
    defaultSeeder: 'DemoSeeder',
    glob: '!(*.d).{js,ts}',
    emit: 'ts',
  },
});
