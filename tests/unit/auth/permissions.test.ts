import { describe, expect, it } from 'vitest';

import { ACTION_WORDS, can, PERMISSIONS } from '@/lib/auth/permissions';
import { ROLES } from '@/lib/domain';

describe('the permissions table', () => {
  it('lets installers print issued schedules but not drafts, and everyone else both', () => {
    for (const role of ROLES) expect(can(role, 'schedule.print')).toBe(true);
    expect(ROLES.filter((role) => can(role, 'schedule.print-draft'))).toEqual(['admin', 'designer', 'inspector']);
  });

  it('may print a draft only where it may print at all', () => {
    for (const role of ROLES) if (can(role, 'schedule.print-draft')) expect(can(role, 'schedule.print')).toBe(true);
  });

  it('has words for every action, for the refusals', () => {
    for (const action of Object.keys(PERMISSIONS)) {
      expect(ACTION_WORDS[action as keyof typeof PERMISSIONS]).toMatch(/^[a-z]/);
    }
  });
});
