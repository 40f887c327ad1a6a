import 'server-only';

import { Op, type Transaction } from 'sequelize';

import { can } from '@/lib/auth/permissions';
import type { LifecycleNotice, LifecycleStep } from '@/lib/boards/lifecycle';
import { layoutWays } from '@/lib/boards/layout';
import { readWays } from '@/lib/dal/board-repository';
import { enqueueMail } from '@/lib/mail/outbox';
import { renderNotice, type MailComment, type NoticeFacts } from '@/lib/mail/templates';
import { AuditEvent, type Board, Comment, User } from '@/models';

export type Recipient = { email: string; name: string };

/**
 * Who gets the review e-mails: the designer who made the board and the last designer
 * (or admin) who changed or submitted it, if still active members; failing both, every
 * active designer of the organisation.
 */
async function designers(board: Board, transaction: Transaction): Promise<Recipient[]> {
  const last = await AuditEvent.findOne({
    where: {
      boardId: board.id,
      organisationId: board.organisationId,
      action: { [Op.in]: ['board.saved', 'board.status'] },
      userId: { [Op.ne]: null },
    },
    order: [['id', 'DESC']],
    transaction,
  });
  const ids = [board.createdById, last?.userId].filter((id): id is string => !!id);
  const people = ids.length
    ? await User.findAll({
        where: { id: { [Op.in]: ids }, organisationId: board.organisationId, active: true },
        transaction,
      })
    : [];
  const chosen = people.filter((u) => can(u.role, 'boards.edit'));
  const all = chosen.length
    ? chosen
    : await User.findAll({
        where: { organisationId: board.organisationId, role: 'designer', active: true },
        transaction,
      });
  const byEmail = new Map(all.map((u) => [u.email, { email: u.email, name: u.name }]));
  return [...byEmail.values()];
}

/** Every active inspector of the board's organisation. */
async function inspectors(board: Board, transaction: Transaction): Promise<Recipient[]> {
  const rows = await User.findAll({
    where: { organisationId: board.organisationId, role: 'inspector', active: true },
    attributes: ['email', 'name'],
    transaction,
  });
  return rows.map((u) => ({ email: u.email, name: u.name }));
}

/** The people a notice goes to. */
export function noticeRecipients(
  to: LifecycleNotice['to'],
  board: Board,
  transaction: Transaction,
): Promise<Recipient[]> {
  return to === 'inspectors' ? inspectors(board, transaction) : designers(board, transaction);
}

/** The comments of the board's current revision, oldest first, as the e-mails list them. */
export async function revisionComments(board: Board, transaction: Transaction): Promise<MailComment[]> {
  // One after another: both run on the transaction's one connection
  const comments = await Comment.findAll({
    where: { boardId: board.id, revision: board.revision },
    include: [{ model: User, as: 'author', attributes: ['name'] }],
    order: [['createdAt', 'ASC']],
    transaction,
  });
  const ways = await readWays(board.id, transaction);
  const refs = new Map(layoutWays(board.phases, ways).map((p) => [p.id, p.label]));
  return comments.map((c) => ({
    wayId: c.wayId,
    wayRef: c.wayId ? (refs.get(c.wayId) ?? null) : null,
    authorName: (c as Comment & { author?: User }).author?.name ?? null,
    body: c.body,
  }));
}

/**
 * Queues the e-mails a lifecycle step sends (lib/boards/lifecycle.ts says which), in the
 * caller's transaction so that they go only if the step is committed. The caller gathers the
 * facts; the words come from lib/mail/templates.ts.
 */
export async function queueNotices(
  step: LifecycleStep,
  board: Board,
  facts: Partial<NoticeFacts>,
  transaction: Transaction,
): Promise<void> {
  for (const notice of step.notify) {
    const f = facts[notice.template];
    if (!f) throw new Error(`The facts of the ${notice.template} e-mail were not gathered`);
    for (const person of await noticeRecipients(notice.to, board, transaction)) {
      await enqueueMail(
        { organisationId: board.organisationId, to: person.email, ...renderNotice(notice.template, f, person) },
        transaction,
      );
    }
  }
}
