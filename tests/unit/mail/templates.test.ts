import { describe, expect, it } from 'vitest';

import {
  commentLine,
  invitationMail,
  issuedMail,
  MAIL_CAUTION,
  renderNotice,
  returnedMail,
  reviewRequestedMail,
  scheduleMail,
  sitePackMail,
  type IssuedFacts,
  type ReturnedFacts,
  type ReviewRequestedFacts,
} from '@/lib/mail/templates';
import { SIZING_CAUTION } from '@/lib/sizing';

const appUrl = 'https://boards.larchfield.example.test/';
const boardId = '3f1c2a9e-0000-4000-8000-000000000001';

const requested: ReviewRequestedFacts = {
  appUrl,
  boardId,
  boardName: 'Workshop DB1',
  siteName: 'Hollin Lane Joinery',
  revision: 2,
  senderName: 'Priya Okafor',
  counts: '8 ways: 6 circuits, 2 spare',
  boardChecks: [],
};

describe('the review request', () => {
  it('greets the inspector, names the board, its revision, its ways and the link, and carries the caution', () => {
    const mail = reviewRequestedMail(requested, { name: 'Sam Hale' });
    expect(mail.subject).toBe('For review: Workshop DB1 (Hollin Lane Joinery), revision 2');
    expect(mail.text).toBe(
      [
        'Hello Sam Hale,',
        '',
        'Priya Okafor has sent the board "Workshop DB1" at Hollin Lane Joinery for review.',
        'Revision 2: 8 ways: 6 circuits, 2 spare; no way fails.',
        '',
        `Open it: https://boards.larchfield.example.test/boards/${boardId}`,
        '',
        MAIL_CAUTION,
      ].join('\n'),
    );
    expect(MAIL_CAUTION).toContain('checked by a competent person');
  });

  it('lists the failing board-level checks, and says "the site" when the site is unknown', () => {
    const mail = reviewRequestedMail(
      {
        ...requested,
        siteName: null,
        boardChecks: [{ message: 'The main switch is smaller than the maximum demand.', reference: 'BS 7671 433.1.1' }],
      },
      { name: 'Sam Hale' },
    );
    expect(mail.subject).toBe('For review: Workshop DB1 (site), revision 2');
    expect(mail.text).toContain('at the site for review.');
    expect(mail.text).toContain(
      'Board-level checks to look at:\n- The main switch is smaller than the maximum demand. (BS 7671 433.1.1)',
    );
  });
});

const comments = [
  { wayId: null, wayRef: null, authorName: 'Sam Hale', body: 'Label the ring ends at the board.' },
  { wayId: 'w-3', wayRef: '3', authorName: null, body: 'Check the ring length.' },
  { wayId: 'w-gone', wayRef: null, authorName: 'Sam Hale', body: 'Why two here?' },
];

describe('a comment in an e-mail', () => {
  it('names the way by its reference, a removed way and a former member in words', () => {
    expect(comments.map(commentLine)).toEqual([
      '- Board (Sam Hale): Label the ring ends at the board.',
      '- Way 3 (A former member): Check the ring length.',
      '- A way since removed (Sam Hale): Why two here?',
    ]);
  });
});

describe('the issue and return e-mails', () => {
  const issued: IssuedFacts = {
    appUrl,
    boardId,
    boardName: 'Workshop DB1',
    siteName: 'Hollin Lane Joinery',
    revision: 3,
    approverName: 'Sam Hale',
    declaration: 'Sam Hale',
    comments: comments.slice(0, 1),
  };

  it('tells the designers the revision issued, who declared it, the comments and both links', () => {
    const mail = issuedMail(issued);
    expect(mail.subject).toBe('Issued: Workshop DB1, revision 3');
    expect(mail.text).toBe(
      [
        'Sam Hale approved Workshop DB1 (Hollin Lane Joinery). It is issued as revision 3.',
        'Declared by Sam Hale.',
        '',
        'Comments on this revision:',
        '- Board (Sam Hale): Label the ring ends at the board.',
        '',
        `Board: https://boards.larchfield.example.test/boards/${boardId}`,
        `Schedule: https://boards.larchfield.example.test/boards/${boardId}/schedule?revision=3`,
      ].join('\n'),
    );
  });

  it('leaves out the comment heading when there were none', () => {
    expect(issuedMail({ ...issued, comments: [] }).text).not.toContain('Comments on this revision');
  });

  it('returns with every comment and a link to the review notes in the editor', () => {
    const returned: ReturnedFacts = {
      appUrl,
      boardId,
      boardName: 'Workshop DB1',
      siteName: 'Hollin Lane Joinery',
      revision: 2,
      returnerName: 'Sam Hale',
      comments,
    };
    const mail = returnedMail(returned);
    expect(mail.subject).toBe('Returned for changes: Workshop DB1, revision 2');
    expect(mail.text.split('\n')).toEqual([
      'Sam Hale returned Workshop DB1 (Hollin Lane Joinery) to draft with these comments:',
      '',
      '- Board (Sam Hale): Label the ring ends at the board.',
      '- Way 3 (A former member): Check the ring length.',
      '- A way since removed (Sam Hale): Why two here?',
      '',
      `Read the comments beside the ways they are about: https://boards.larchfield.example.test/boards/${boardId}#review-notes`,
    ]);
  });

  it('renders each lifecycle notice with its own template', () => {
    expect(renderNotice('issued', issued, { name: 'Priya Okafor' })).toEqual(issuedMail(issued));
    expect(renderNotice('review-requested', requested, { name: 'Sam Hale' }).text).toContain('Hello Sam Hale,');
  });
});

describe('a schedule sent by e-mail', () => {
  const facts = {
    boardUrl: `https://boards.larchfield.example.test/boards/${boardId}`,
    boardName: 'Flat DB',
    siteName: 'Hollin Lane Joinery',
    revision: 4,
    senderName: 'Priya Okafor',
  };

  it('says an issued revision plainly, with the sender’s message', () => {
    const mail = scheduleMail({ ...facts, frozen: true, message: 'For the door of the cupboard.' });
    expect(mail.subject).toBe('Board schedule: Flat DB, revision 4');
    expect(mail.text).toBe(
      [
        'Priya Okafor sent you the board schedule of Flat DB (Hollin Lane Joinery), revision 4.',
        '',
        'For the door of the cupboard.',
        '',
        `The schedule is attached as a PDF. Board: ${facts.boardUrl}`,
      ].join('\n'),
    );
  });

  it('marks a draft as not yet issued, in the subject and the text', () => {
    const mail = scheduleMail({ ...facts, frozen: false });
    expect(mail.subject).toBe('Board schedule: Flat DB, revision 4 (draft)');
    expect(mail.text.split('\n')[0]).toBe(
      'Priya Okafor sent you the board schedule of Flat DB (Hollin Lane Joinery), revision 4, not yet issued.',
    );
    expect(mail.text.split('\n')).toHaveLength(3);
  });
});

describe('an invitation', () => {
  it('names the organisation, who invited, the role and the one-time link', () => {
    const mail = invitationMail({
      organisationName: 'Larchfield Electrical',
      inviteeName: 'Dev Marsh',
      inviterName: 'Priya Okafor',
      role: 'installer',
      link: 'https://boards.larchfield.example.test/invite/abc',
    });
    expect(mail.subject).toBe('You are invited to Larchfield Electrical on Boardwright');
    expect(mail.text.split('\n')).toEqual([
      'Hello Dev Marsh,',
      '',
      'Priya Okafor has invited you to join Larchfield Electrical on Boardwright as installer.',
      'Choose your password here (the link works once and expires in 7 days):',
      'https://boards.larchfield.example.test/invite/abc',
      '',
      'If you were not expecting this, ignore this message.',
    ]);
  });

  it('still reads when the organisation is unknown', () => {
    const mail = invitationMail({
      organisationName: null,
      inviteeName: 'A',
      inviterName: 'B',
      role: 'designer',
      link: 'x',
    });
    expect(mail.subject).toBe('You are invited to a team on Boardwright');
    expect(mail.text).toContain('join their team on Boardwright');
  });
});

describe('a site pack sent by e-mail', () => {
  it('says who sent what the pack holds, with the note and the design-aid caution', () => {
    const mail = sitePackMail({
      siteName: 'Hollin Lane Joinery',
      boardCount: 2,
      senderName: 'Priya Okafor',
      message: 'For the site file.',
    });
    expect(mail.subject).toBe('Site pack: Hollin Lane Joinery');
    expect(mail.text).toBe(
      [
        'Priya Okafor sent you the site pack of Hollin Lane Joinery: the single-line diagram of its supply, the values carried to each board, and the schedule of each of its 2 boards.',
        '',
        'For the site file.',
        '',
        'The pack is attached as a PDF.',
        '',
        SIZING_CAUTION,
      ].join('\n'),
    );
  });

  it('counts one board as one, and leaves the note out when there is none', () => {
    const mail = sitePackMail({ siteName: 'Hollin Lane Joinery', boardCount: 1, senderName: 'Priya Okafor' });
    expect(mail.text.split('\n').slice(0, 2)).toEqual([
      'Priya Okafor sent you the site pack of Hollin Lane Joinery: the single-line diagram of its supply, the values carried to each board, and the schedule of each of its 1 board.',
      '',
    ]);
    expect(mail.text).not.toContain('For the site file.');
  });
});
