import fc from 'fast-check';
import { describe, expect, it } from 'vitest';

import { describeAuditEntry } from '@/features/audit/utils/describe-event';
import {
  editableInPlace,
  labelsEvent,
  LIFECYCLE_EVENTS,
  transition,
  type LifecycleEvent,
  type LifecycleStep,
} from '@/lib/boards/lifecycle';
import { statusAfterLabels } from '@/lib/boards/record-rules';
import type { AuditAction } from '@/lib/dal/audit';
import { BOARD_STATUSES, LABEL_STATUSES, type BoardStatus } from '@/lib/domain';

const status = fc.constantFrom(...BOARD_STATUSES);
const event = fc.constantFrom(...LIFECYCLE_EVENTS);
const revision = fc.integer({ min: 1, max: 500 });

/** Every allowed step of the table. */
const steps: LifecycleStep[] = BOARD_STATUSES.flatMap((s) =>
  LIFECYCLE_EVENTS.map((e) => transition(s, e, { revision: 1 })).filter((o): o is LifecycleStep => !o.refused),
);

describe('the lifecycle table', () => {
  it('answers every event in every status, and an allowed one leads to a known status', () => {
    fc.assert(
      fc.property(status, event, revision, (s, e, r) => {
        const out = transition(s, e, { revision: r });
        if (out.refused) expect(out.status).toBe(409);
        else {
          expect(BOARD_STATUSES).toContain(out.to);
          expect(out.from).toBe(s);
        }
      }),
    );
  });

  it('records every status change with an audit action that the audit screen describes in words', () => {
    expect(steps.length).toBeGreaterThan(0);
    for (const step of steps) {
      if (step.to !== step.from || step.startsRevision) expect(step.audit).not.toBeNull();
      if (step.audit === null) continue;
      // The DAL hands this to audit(): it must be one of the trail's actions
      const action: AuditAction = step.audit;
      // describeAuditEntry falls back to the bare code for an action it does not know
      const words = describeAuditEntry({ action, details: {}, wayLabel: null });
      expect(words).not.toBe(action);
      expect(words).toMatch(/^[a-z]/);
    }
  });

  it('sends notices only when the status changes', () => {
    for (const step of steps) if (step.to === step.from) expect(step.notify).toEqual([]);
  });

  it('refuses an event with a sentence that says why, in words rather than codes', () => {
    fc.assert(
      fc.property(status, event, revision, (s, e, r) => {
        const out = transition(s, e, { revision: r });
        if (!out.refused) return;
        expect(out.message).toMatch(/^[A-Z].{20,}\.$/);
        for (const code of [...BOARD_STATUSES, ...LIFECYCLE_EVENTS].filter((c) => c.includes('-'))) {
          expect(out.message).not.toContain(code);
        }
        // A refusal that names a revision names this board's
        for (const m of out.message.matchAll(/revision (\d+)/g)) expect(Number(m[1])).toBe(r);
      }),
    );
  });

  it('keeps the words the screens and the tests already show for the refusals', () => {
    expect(transition('in-review', 'save', { revision: 2 })).toMatchObject({
      refused: true,
      message: 'The board is in review; it can be changed once the inspector returns it.',
    });
    expect(transition('draft', 'approve', { revision: 2 })).toMatchObject({
      message: 'Only a board in review can be approved; this board is a draft.',
    });
    expect(transition('issued', 'return', { revision: 2 })).toMatchObject({
      message: 'Only a board in review can be returned; this board is issued.',
    });
    expect(transition('issued', 'submit', { revision: 3 })).toMatchObject({
      message:
        'Only a draft can be sent for review; this board is already issued (revision 3); a change to it starts the next revision.',
    });
    expect(transition('in-review', 'submit', { revision: 3 })).toMatchObject({
      message: 'Only a draft can be sent for review; this board is already in review.',
    });
    expect(transition('draft', 'labels-all-match', { revision: 1 })).toMatchObject({
      message: 'The label walk is for issued boards; this board has not been issued yet.',
    });
  });

  it('sends a draft for review to the inspectors, and tells the designers of an approval or a return', () => {
    expect(transition('draft', 'submit', { revision: 1 })).toMatchObject({
      to: 'in-review',
      audit: 'board.status',
      notify: [{ template: 'review-requested', to: 'inspectors' }],
    });
    expect(transition('in-review', 'approve', { revision: 1 })).toMatchObject({
      to: 'issued',
      audit: 'review.approved',
      notify: [{ template: 'issued', to: 'designers' }],
    });
    expect(transition('in-review', 'return', { revision: 1 })).toMatchObject({
      to: 'draft',
      audit: 'review.returned',
      notify: [{ template: 'returned', to: 'designers' }],
    });
  });

  it('issues a board only by approving it in review', () => {
    for (const step of steps) {
      const issuedAfter = step.to === 'issued' || step.to === 'labels-matched';
      const issuedBefore = step.from === 'issued' || step.from === 'labels-matched';
      if (issuedAfter && !issuedBefore) expect([step.from, step.to]).toEqual(['in-review', 'issued']);
    }
  });

  it('asks for confirmation only where a label check undoes a board’s labels matched on site', () => {
    for (const step of steps) {
      expect(step.needsConfirmation).toBe(step.from === 'labels-matched' && step.to === 'issued');
    }
  });

  it('never leaves an issued revision editable, whatever events follow', () => {
    // A board as the DAL keeps it: its status, its revision, and the revisions ever issued
    type Model = { status: BoardStatus; revision: number; issued: Set<number> };
    fc.assert(
      fc.property(fc.array(event, { maxLength: 60 }), (events: LifecycleEvent[]) => {
        const board: Model = { status: 'draft', revision: 1, issued: new Set() };
        for (const e of events) {
          const out = transition(board.status, e, { revision: board.revision });
          if (out.refused) continue;
          if (out.startsRevision) board.revision += 1;
          if (out.from === 'in-review' && out.to === 'issued') board.issued.add(board.revision);
          board.status = out.to;
          // Changeable (or waiting for review) only at a revision never issued; issued only at an issued one
          if (editableInPlace(board.status) || board.status === 'in-review') {
            expect(board.issued.has(board.revision)).toBe(false);
          } else {
            expect(board.issued.has(board.revision)).toBe(true);
          }
        }
      }),
      { numRuns: 500 },
    );
  });
});

describe('the walk’s event', () => {
  it('is every label matching only when there are labels and each one matches', () => {
    expect(labelsEvent([])).toBe('label-not-matching');
    expect(labelsEvent(['matches', 'matches'])).toBe('labels-all-match');
    expect(labelsEvent(['matches', 'unchecked'])).toBe('label-not-matching');
  });

  it('leads an issued board where the label rule of lib/boards/record-rules.ts says', () => {
    fc.assert(
      fc.property(
        fc.constantFrom<BoardStatus>('issued', 'labels-matched'),
        fc.array(fc.constantFrom(...LABEL_STATUSES), { maxLength: 8 }),
        (s, labels) => {
          const out = transition(s, labelsEvent(labels), { revision: 1 });
          expect(out.refused).toBe(false);
          if (!out.refused) expect(out.to).toBe(statusAfterLabels(s, labels));
        },
      ),
    );
  });
});
