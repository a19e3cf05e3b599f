import type { MikroORM } from '@mikro-orm/mariadb';

/**
 * Runs `job` only if this process gets MariaDB's named lock `name` (GET_LOCK), so a scheduled job
 * runs once however many api instances share the database. The lock belongs to one connection,
 * so it is taken and released on one connection held for the whole job.
 * Returns false when another instance holds the lock.
 */
export async function withNamedLock(orm: MikroORM, name: string, job: () => Promise<void>): Promise<boolean> {
  const knex = orm.em.getConnection().getKnex();
  const client = knex.client as unknown as {
    acquireConnection(): Promise<unknown>;
    releaseConnection(c: unknown): Promise<void>;
  };
  const conn = await client.acquireConnection();
  const query = (sql: string, bindings: unknown[]) => knex.raw(sql, bindings as never).connection(conn as never);
  try {
    const res = (await query('SELECT GET_LOCK(?, 0) AS got', [name])) as unknown as [[{ got: number | null }]];
    if (Number(res[0][0]?.got) !== 1) return false;
    try {
      await job();
    } finally {
      await query('SELECT RELEASE_LOCK(?)', [name]);
    }
    return true;
  } finally {
    await client.releaseConnection(conn);
  }
}
