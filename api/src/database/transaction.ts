import { DeadlockException, LockWaitTimeoutException } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/mariadb';

/**
 * Runs `work` in a transaction on a fresh EntityManager, again (up to 5 times) when MariaDB picks it
 * as a deadlock victim or a lock wait times out: everything rolled back, so a retry is safe.
 */
export async function withTransaction<T>(em: EntityManager, work: (tx: EntityManager) => Promise<T>): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await em.fork().transactional((tx) => work(tx as EntityManager));
    } catch (e) {
      const retryable = e instanceof DeadlockException || e instanceof LockWaitTimeoutException;
      if (!retryable || attempt >= 5) throw e;
      await new Promise((r) => setTimeout(r, 10 * attempt + Math.floor(Math.random() * 20)));
    }
  }
}
