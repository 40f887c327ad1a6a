import 'server-only';

import { Op, type Transaction, type WhereOptions } from 'sequelize';

import { can } from '@/lib/auth/permissions';
import type { LifecycleNotice, LifecycleStep } from '@/lib/boards/lifecycle';
import { wayLabelMap } from '@/lib/boards/layout';
import { readWays, type BoardRecord } from '@/lib/dal/board-repository';
import { commentsOf } from '@/lib/dal/comments';
import { enqueueMail } from '@/lib/mail/outbox';
import { renderNotice, type MailComment, type NoticeFacts } from '@/lib/mail/templates';
import { AuditEvent, User } from '@/models';

type Recipient = { email: string; name: string };

/**
 * Who gets the review e-mails: the designer who made the board and the last designer
 * (or admin) who changed or submitted it, if still active members; failing both, every
 * active designer of the organisation.
 */
async function designers(board: BoardRecord, transaction: Transaction): Promise<Recipient[]> {
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
  const people = await activeMembers(board, { id: { [Op.in]: ids } }, transaction);
  const chosen = people.filter((u) => can(u.role, 'boards.edit'));
  return chosen.length ? chosen : activeMembers(board, { role: 'designer' }, transaction);
}

/** The active members of the board's organisation that `where` picks, as recipients. */
async function activeMembers(board: BoardRecord, where: WhereOptions<User>, transaction: Transaction) {
  const users = await User.findAll({
    where: { ...where, organisationId: board.organisationId, active: true },
    transaction,
  });
  return users.map((u) => ({ email: u.email, name: u.name, role: u.role }));
}

/** The comments of the board's current revision, oldest first, as the e-mails list them. */
export async function revisionComments(board: BoardRecord, transaction: Transaction): Promise<MailComment[]> {
  // One after another: both run on the transaction's one connection
  const comments = await commentsOf(board.id, board.revision, transaction);
  const refs = wayLabelMap(board.phases, await readWays(board.id, transaction));
  return comments.map(({ wayId, authorName, body }) => ({
    wayId,
    wayRef: wayId ? (refs.get(wayId) ?? null) : null,
    authorName,
    body,
  }));
}

/**
 * The e-mails a lifecycle step sends (lib/boards/lifecycle.ts says which). The transaction
 * gathers only the facts and the recipients; once it is committed, each e-mail is rendered
 * (lib/mail/templates.ts) and queued in the outbox, which sends it and retries it. A step
 * rolled back sends nothing; a failed send is the outbox's to retry and never undoes the step.
 */
export async function queueNotices(
  step: LifecycleStep,
  board: BoardRecord,
  facts: Partial<NoticeFacts>,
  transaction: Transaction,
): Promise<void> {
  const mails: { template: LifecycleNotice['template']; facts: NoticeFacts[keyof NoticeFacts]; to: Recipient }[] = [];
  for (const { template, to } of step.notify) {
    const f = facts[template];
    if (!f) throw new Error(`The facts of the ${template} e-mail were not gathered`);
    const people =
      to === 'inspectors' ? activeMembers(board, { role: 'inspector' }, transaction) : designers(board, transaction);
    for (const { email, name } of await people) mails.push({ template, facts: f, to: { email, name } });
  }
  if (!mails.length) return;
  transaction.afterCommit(async () => {
    for (const { template, facts, to } of mails) {
      // The change is committed: a mail that cannot be queued is logged, never reported as a failed change
      try {
        const content = renderNotice(template, facts as never, to);
        await enqueueMail({ organisationId: board.organisationId, to: to.email, ...content });
      } catch (err) {
        console.error(`The ${template} e-mail to ${to.email} could not be queued`, err);
      }
    }
  });
}
