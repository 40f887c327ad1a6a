import fc from 'fast-check';
import { describe, expect, it } from 'vitest';

import {
  boardRemoval,
  issueRefusal,
  labelChangeUnverifies,
  mayRestore,
  revisionAfter,
  sameName,
  siteRemoval,
} from '@/lib/boards/record-rules';
import { BOARD_STATUSES, LABEL_STATUSES, ROLES } from '@/lib/domain';

describe('removing a board', () => {
  it('deletes a never-issued board for designers and admins, archives an issued one for admins only', () => {
    expect(boardRemoval('designer', { everIssued: false, archived: false })).toEqual({
      refused: false,
      effect: 'delete',
    });
    expect(boardRemoval('admin', { everIssued: false, archived: false })).toEqual({ refused: false, effect: 'delete' });
    expect(boardRemoval('admin', { everIssued: true, archived: false })).toEqual({ refused: false, effect: 'archive' });
    expect(boardRemoval('designer', { everIssued: true, archived: false })).toMatchObject({
      refused: true,
      status: 403,
    });
    expect(boardRemoval('inspector', { everIssued: false, archived: false })).toMatchObject({
      refused: true,
      status: 403,
    });
    expect(boardRemoval('admin', { everIssued: true, archived: true })).toMatchObject({ refused: true, status: 409 });
  });

  it('an issued board is never deleted, by any role', () => {
    fc.assert(
      fc.property(fc.constantFrom(...ROLES), fc.boolean(), (role, archived) => {
        const rule = boardRemoval(role, { everIssued: true, archived });
        expect(rule.refused || rule.effect === 'archive').toBe(true);
      }),
    );
  });
});

describe('archiving a site', () => {
  it('a site holding an issued board: admins only; otherwise whoever may discard boards', () => {
    expect(siteRemoval('admin', { holdsIssued: true, archived: false })).toEqual({ refused: false });
    expect(siteRemoval('designer', { holdsIssued: true, archived: false })).toMatchObject({
      refused: true,
      status: 403,
    });
    expect(siteRemoval('designer', { holdsIssued: false, archived: false })).toEqual({ refused: false });
    expect(siteRemoval('installer', { holdsIssued: false, archived: false })).toMatchObject({
      refused: true,
      status: 403,
    });
    expect(siteRemoval('admin', { holdsIssued: false, archived: true })).toMatchObject({ refused: true, status: 409 });
  });

  it('restores: archived records by admins, deleted drafts by designers too', () => {
    expect(ROLES.filter((r) => mayRestore(r, 'archived'))).toEqual(['admin']);
    expect(ROLES.filter((r) => mayRestore(r, 'deleted'))).toEqual(['admin', 'designer']);
  });
});

describe('separation of duties', () => {
  const me = 'a0000000-0000-4000-8000-000000000001';
  const you = 'a0000000-0000-4000-8000-000000000002';
  it('refuses the last designer, unless self-issue is allowed', () => {
    expect(issueRefusal({ issuerId: me, designChangedById: me, allowSelfIssue: false })).toMatchObject({ status: 403 });
    expect(issueRefusal({ issuerId: me, designChangedById: me, allowSelfIssue: true })).toBeNull();
    expect(issueRefusal({ issuerId: me, designChangedById: you, allowSelfIssue: false })).toBeNull();
    expect(issueRefusal({ issuerId: me, designChangedById: null, allowSelfIssue: false })).toBeNull();
  });

  it('a typed name matches whatever its case, spacing and accents, and only the same name', () => {
    expect(sameName('  jo   BRÖNTE ', 'Jo Bronte')).toBe(true);
    expect(sameName('Jo Bronte', 'Jo Brontes')).toBe(false);
    expect(sameName('   ', '')).toBe(false);
  });
});

describe('label checks and the board status', () => {
  it('the walk warns exactly when a label other than matching is recorded on a labels-matched board', () => {
    fc.assert(
      fc.property(fc.constantFrom(...BOARD_STATUSES), fc.constantFrom(...LABEL_STATUSES), (status, next) => {
        expect(labelChangeUnverifies(status, next)).toBe(status === 'labels-matched' && next !== 'matches');
      }),
    );
  });
});

describe('the revision a board is issued as', () => {
  it('is its own revision, unless that one was issued already', () => {
    expect(revisionAfter(1, 0)).toBe(1); // never issued: revision 1
    expect(revisionAfter(2, 1)).toBe(2); // the draft after issue 1
    expect(revisionAfter(1, 1)).toBe(2); // revision 1 issued meanwhile: the next one
  });

  it('is never one issued already, nor below the board’s own', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 500 }), fc.integer({ min: 0, max: 500 }), (revision, lastIssued) => {
        const next = revisionAfter(revision, lastIssued);
        expect(next).toBeGreaterThan(lastIssued);
        expect(next).toBeGreaterThanOrEqual(revision);
      }),
    );
  });
});
