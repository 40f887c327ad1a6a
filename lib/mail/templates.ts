/**
 * The words of the e-mails a board's lifecycle sends, of a schedule or site pack sent by e-mail and of an invitation. Plain
 * functions from facts the DAL gathered (under the board's lock) to a subject and a text: no
 * database, no environment, so the unit tests read exactly what a person receives.
 */
import type { LifecycleNotice } from '@/lib/boards/lifecycle';
import type { Role } from '@/lib/domain';
import { wayTitle } from '@/lib/names';
import { SIZING_CAUTION } from '@/lib/sizing';

export type MailContent = { subject: string; text: string };

/** One review comment as an e-mail lists it. */
export type MailComment = {
  /** Null for a comment on the whole board. */
  wayId: string | null;
  /** The way's printed reference, null when the way has none any more (removed since). */
  wayRef: string | null;
  /** Null when the author is no longer a member. */
  authorName: string | null;
  body: string;
};

const FORMER_MEMBER = 'A former member';

/** The safety caution every review request carries. */
export const MAIL_CAUTION =
  'Boardwright is a design aid: results must be checked by a competent person against the current edition of BS 7671 (or local wiring rules) and manufacturers’ data.';

const link = (appUrl: string, path: string) => new URL(path, appUrl).href;

/** "- Way 3 (Jo Bronte): Check the ring length." */
export function commentLine(c: MailComment): string {
  const where = c.wayId ? (c.wayRef ? wayTitle(c.wayRef) : 'A way since removed') : 'Board';
  return `- ${where} (${c.authorName ?? FORMER_MEMBER}): ${c.body}`;
}

export type ReviewRequestedFacts = {
  appUrl: string;
  boardId: string;
  boardName: string;
  /** Null when the site could not be read. */
  siteName: string | null;
  revision: number;
  senderName: string;
  /** The count of ways in the words of the boards list (lib/boards/counts.ts). */
  counts: string;
  /** Board-level checks that fail, for the inspector to judge. */
  boardChecks: { message: string; reference: string }[];
};

/** To an inspector: a board was sent for review. */
export function reviewRequestedMail(f: ReviewRequestedFacts, recipient: { name: string }): MailContent {
  return {
    subject: `For review: ${f.boardName} (${f.siteName ?? 'site'}), revision ${f.revision}`,
    text: [
      `Hello ${recipient.name},`,
      '',
      `${f.senderName} has sent the board "${f.boardName}" at ${f.siteName ?? 'the site'} for review.`,
      `Revision ${f.revision}: ${f.counts}; no way fails.`,
      ...(f.boardChecks.length
        ? ['', 'Board-level checks to look at:', ...f.boardChecks.map((c) => `- ${c.message} (${c.reference})`)]
        : []),
      '',
      `Open it: ${link(f.appUrl, `/boards/${f.boardId}`)}`,
      '',
      MAIL_CAUTION,
    ].join('\n'),
  };
}

export type IssuedFacts = {
  appUrl: string;
  boardId: string;
  boardName: string;
  siteName: string;
  revision: number;
  approverName: string;
  declaration: string;
  comments: MailComment[];
};

/** To the designers: the board was approved and issued. */
export function issuedMail(f: IssuedFacts): MailContent {
  const lines = f.comments.map(commentLine);
  return {
    subject: `Issued: ${f.boardName}, revision ${f.revision}`,
    text: [
      `${f.approverName} approved ${f.boardName} (${f.siteName}). It is issued as revision ${f.revision}.`,
      `Declared by ${f.declaration}.`,
      '',
      ...(lines.length ? ['Comments on this revision:', ...lines, ''] : []),
      `Board: ${link(f.appUrl, `/boards/${f.boardId}`)}`,
      `Schedule: ${link(f.appUrl, `/boards/${f.boardId}/schedule?revision=${f.revision}`)}`,
    ].join('\n'),
  };
}

export type ReturnedFacts = {
  appUrl: string;
  boardId: string;
  boardName: string;
  /** Null when the site could not be read. */
  siteName: string | null;
  revision: number;
  returnerName: string;
  comments: MailComment[];
};

/** To the designers: the board was returned to draft, with every comment of the revision. */
export function returnedMail(f: ReturnedFacts): MailContent {
  return {
    subject: `Returned for changes: ${f.boardName}, revision ${f.revision}`,
    text: [
      `${f.returnerName} returned ${f.boardName} (${f.siteName ?? ''}) to draft with these comments:`,
      '',
      ...f.comments.map(commentLine),
      '',
      // The designer's view of a returned board: the editor, opened at the review notes
      `Read the comments beside the ways they are about: ${link(f.appUrl, `/boards/${f.boardId}#review-notes`)}`,
    ].join('\n'),
  };
}

/** The facts of each lifecycle notice's template. */
export type NoticeFacts = {
  'review-requested': ReviewRequestedFacts;
  issued: IssuedFacts;
  returned: ReturnedFacts;
};

/** The e-mail of one lifecycle notice to one person. */
export function renderNotice<T extends LifecycleNotice['template']>(
  template: T,
  facts: NoticeFacts[T],
  recipient: { name: string },
): MailContent {
  switch (template) {
    case 'review-requested':
      return reviewRequestedMail(facts as ReviewRequestedFacts, recipient);
    case 'issued':
      return issuedMail(facts as IssuedFacts);
    case 'returned':
      return returnedMail(facts as ReturnedFacts);
    default:
      throw new Error(`No e-mail template ${String(template)}`);
  }
}

export type ScheduleMailFacts = {
  boardUrl: string;
  boardName: string;
  siteName: string;
  revision: number;
  /** True for an issued revision, false for the live draft. */
  frozen: boolean;
  senderName: string;
  /** The sender's own words, if any. */
  message?: string;
};

/** A printed schedule sent to an address (the PDF goes as an attachment). */
export function scheduleMail(f: ScheduleMailFacts): MailContent {
  return {
    subject: `Board schedule: ${f.boardName}, revision ${f.revision}${f.frozen ? '' : ' (draft)'}`,
    text: [
      `${f.senderName} sent you the board schedule of ${f.boardName} (${f.siteName}), revision ${f.revision}${f.frozen ? '' : ', not yet issued'}.`,
      ...(f.message ? ['', f.message] : []),
      '',
      `The schedule is attached as a PDF. Board: ${f.boardUrl}`,
    ].join('\n'),
  };
}

/** What the e-mail carrying a site pack says (lib/dal/schedule-mail.ts emailSitePack). */
export type SitePackMailFacts = { siteName: string; boardCount: number; senderName: string; message?: string };

/** A site pack sent to an address: the sender's note, what the pack holds, and the design-aid caution. */
export function sitePackMail(f: SitePackMailFacts): MailContent {
  return {
    subject: `Site pack: ${f.siteName}`,
    text: [
      `${f.senderName} sent you the site pack of ${f.siteName}: the single-line diagram of its supply, the values carried to each board, and the schedule of each of its ${f.boardCount} board${f.boardCount === 1 ? '' : 's'}.`,
      ...(f.message ? ['', f.message] : []),
      '',
      'The pack is attached as a PDF.',
      '',
      SIZING_CAUTION,
    ].join('\n'),
  };
}

export type InvitationFacts = {
  /** Null when the organisation could not be read. */
  organisationName: string | null;
  inviteeName: string;
  inviterName: string;
  role: Role;
  /** The one-time link that sets the password. */
  link: string;
};

/** To a new member: the invitation with its one-time link. */
export function invitationMail(f: InvitationFacts): MailContent {
  return {
    subject: `You are invited to ${f.organisationName ?? 'a team'} on Boardwright`,
    text: [
      `Hello ${f.inviteeName},`,
      '',
      `${f.inviterName} has invited you to join ${f.organisationName ?? 'their team'} on Boardwright as ${f.role}.`,
      'Choose your password here (the link works once and expires in 7 days):',
      f.link,
      '',
      'If you were not expecting this, ignore this message.',
    ].join('\n'),
  };
}
