import { describe, expect, it } from 'vitest';

import { selectivitySummary } from '@/lib/names';

describe('selectivitySummary: the judgements below a sub-main in brief', () => {
  it('says selective throughout only when every judgement is', () => {
    expect(selectivitySummary(['selective', 'selective'])).toBe('selective throughout');
    expect(selectivitySummary(['selective', 'not-selective'])).toBe('1 selective throughout, 1 not selective');
  });

  it('counts each outcome, in a fixed order, and never calls an unjudged pair not selective', () => {
    expect(selectivitySummary(['cannot-judge', 'cannot-judge', 'cannot-judge'])).toBe(
      '3 cannot be judged from the data held',
    );
    expect(selectivitySummary(['not-selective', 'selective-up-to', 'cannot-judge', 'selective-up-to'])).toBe(
      '2 selective up to a stated current, 1 not selective, 1 cannot be judged from the data held',
    );
  });
});
