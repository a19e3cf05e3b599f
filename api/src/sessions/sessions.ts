import type { EntityManager } from '@mikro-orm/mariadb';

/**
 * Ends every stored session of a user (after a password reset or change), except `keepSessionId`.
 * express-mysql-session keeps the session as JSON; passport puts the user id at $.passport.user.
 */
export async function endSessionsOf(em: EntityManager, userId: number, keepSessionId?: string): Promise<number> {
  const res = (await em
    .getConnection()
    .execute(
      `DELETE FROM sessions WHERE JSON_VALUE(data, '$.passport.user') = ? AND session_id <> ?`,
      [userId, keepSessionId ?? ''],
      'run',
      em.getTransactionContext(),
    )) as { affectedRows?: number };
  return res.affectedRows ?? 0;
}
