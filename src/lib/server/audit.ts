import { db } from './db';
import { auditLog } from './db/schema';

/** the actions the audit log records */
export type AuditAction =
  | 'sign_in'
  | 'sign_in_failed'
  | 'sign_out'
  | 'sign_up'
  | 'password_reset'
  | 'team_created'
  | 'role_changed'
  | 'member_removed'
  | 'member_left'
  | 'invitation_sent'
  | 'invitation_revoked'
  | 'invitation_accepted'
  | 'share_created'
  | 'share_opened'
  | 'share_revoked'
  | 'revision_issued'
  | 'job_exported'
  | 'job_restored';

export interface AuditEntry {
  action: AuditAction;
  teamId?: number | null;
  actorId?: string | null;
  target?: string;
  detail?: Record<string, unknown> | null;
  ip?: string;
  success?: boolean;
}

/** what can write the row: the app's pool, or the transaction a caller holds open */
type Writer = Pick<typeof db, 'insert'>;

/**
 * One row in the audit log; a failure to write it never breaks the request it describes.
 * Inside a transaction, pass it as `writer`: the row then goes over the connection the
 * transaction already holds (and commits or rolls back with it), never a second one from the pool.
 */
export async function audit(entry: AuditEntry, writer: Writer = db): Promise<void> {
  try {
    await writer.insert(auditLog).values({
      action: entry.action,
      teamId: entry.teamId ?? null,
      actorId: entry.actorId ?? null,
      target: (entry.target ?? '').slice(0, 255),
      detail: entry.detail ?? null,
      ip: (entry.ip ?? '').slice(0, 64),
      success: entry.success ?? true,
    });
  } catch (err) {
    // a short line: the failed statement's parameters stay out of the log
    console.error(`audit log write failed (${entry.action}): ${(err as { code?: string }).code ?? (err instanceof Error ? err.message.split('\n')[0].slice(0, 120) : 'error')}`);
  }
}
