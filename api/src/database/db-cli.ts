/**
 * `node dist/src/database/db-cli.js migrate|seed-if-empty|reset` — used by the stack scripts.
 * Migrations run from their committed files; the demo is seeded only into an empty database.
 */
import 'reflect-metadata';
import { MikroORM } from '@mikro-orm/mariadb';
import config from '../mikro-orm.config';
import { User } from '../users/user.entity';
import { DemoSeeder } from './seeders/DemoSeeder';

async function main(command: string | undefined) {
  const orm = await MikroORM.init({ ...config, debug: false });
  try {
    if (command === 'migrate') {
      const done = await orm.migrator.up();
      console.log(done.length ? `[db] applied ${done.map((m) => m.name).join(', ')}` : '[db] schema is up to date');
    } else if (command === 'seed-if-empty') {
      const users = await orm.em.fork().count(User, {});
      if (users > 0) console.log(`[db] ${users} accounts already here; demo not re-seeded`);
      else {
        await orm.seeder.seed(DemoSeeder);
        console.log('[db] seeded the demo guilds');
      }
    } else {
      throw new Error('usage: db-cli migrate|seed-if-empty');
    }
  } finally {
    await orm.close(true);
  }
}

main(process.argv[2]).catch((e: unknown) => {
  console.error(e instanceof Error ? e.message : e);
  process.exit(1);
});
