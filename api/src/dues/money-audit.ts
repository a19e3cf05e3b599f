import type { EntityManager } from '@mikro-orm/mariadb';
import type { Guild } from '../guilds/guild.entity';
import { MoneyAuditEntry, type AuditAction } from './money-audit.entity';

export const PAYMENT_SERVICE = 'Payment service';

export interface AuditLine {
  guild: Guild | number;
  /** The member who acted (her membership id), or null for the payment service. */
  actor: number | null;
  /** Required with an actor: her name as it reads in the log. */
  actorName?: string;
  action: AuditAction;
  subjectType: 'invoice' | 'plan' | 'settings' | 'membership' | 'household';
  subjectId?: number | null;
  summary: string;
  detail?: Record<string, unknown>;
}

/** Appends one line to the money audit log inside the caller's transaction. */
export function writeAudit(tx: EntityManager, line: AuditLine): MoneyAuditEntry {
  return tx.create(MoneyAuditEntry, {
    guild: line.guild,
    actor: line.actor,
    actorName: (line.actorName ?? PAYMENT_SERVICE).slice(0, 120),
    action: line.action,
    subjectType: line.subjectType,
    subjectId: line.subjectId ?? null,
    summary: line.summary.slice(0, 500),
    detail: line.detail ?? {},
    at: new Date(),
  });
}
