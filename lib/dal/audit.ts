import type { Transaction } from 'sequelize';

import type { Actor } from '@/lib/auth/session';
import { AuditEvent } from '@/models';

export type AuditAction =
  | 'board.created'
  | 'board.renamed'
  | 'board.deleted'
  | 'board.saved'
  | 'way.added'
  | 'way.removed'
  | 'way.moved'
  | 'way.changed'
  | 'board.status'
  | 'board.comment'
  | 'label.checked'
  | 'site.created'
  | 'site.renamed'
  | 'site.deleted'
  | 'member.invited'
  | 'member.changed'
  | 'schedule.emailed';

/** Appends one event to the audit trail, inside the caller's transaction when given. */
export async function audit(
  actor: Actor,
  action: AuditAction,
  details: Record<string, unknown>,
  opts: { boardId?: string | null; transaction?: Transaction } = {},
): Promise<void> {
  await AuditEvent.create(
    {
      organisationId: actor.organisationId,
      boardId: opts.boardId ?? null,
      userId: actor.userId,
      action,
      details,
    },
    { transaction: opts.transaction },
  );
}

export type AuditEntry = {
  id: string;
  action: string;
  details: Record<string, unknown>;
  userName: string | null;
  createdAt: string;
};
