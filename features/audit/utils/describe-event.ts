import type { AuditEntry } from '@/lib/audit-types';
import type { BoardStatus } from '@/lib/domain';
import { BOARD_STATUS_NAMES, LABEL_STATUS_NAMES } from '@/lib/names';

// Stages stored in events written before migration 0007 keep their old code
const OLD_STATUS: Record<string, BoardStatus> = { verified: 'labels-matched' };

const text = (value: unknown) => (typeof value === 'string' || typeof value === 'number' ? String(value) : '');

const statusWord = (value: unknown) => {
  const code = OLD_STATUS[text(value)] ?? text(value);
  return (BOARD_STATUS_NAMES as Record<string, string>)[code]?.toLowerCase() ?? 'another stage';
};
const labelWord = (value: unknown) =>
  (LABEL_STATUS_NAMES as Record<string, string>)[text(value)]?.toLowerCase() ?? 'not recorded';

/** "way 7" when the way still has a printed reference, else "a way". */
function wayRef(entry: Pick<AuditEntry, 'wayLabel'>): string {
  return entry.wayLabel ? `way ${entry.wayLabel}` : 'a way';
}

/** What an audit event did, in a few plain words, after the name of who did it. */
export function describeAuditEntry(entry: Pick<AuditEntry, 'action' | 'details' | 'wayLabel'>): string {
  const d = entry.details ?? {};
  switch (entry.action) {
    case 'board.created':
      return 'created the board';
    case 'board.renamed': {
      const parts = [
        d.name !== undefined ? `renamed the board “${text(d.name)}”` : '',
        d.location !== undefined ? `set its location to “${text(d.location)}”` : '',
      ].filter(Boolean);
      return parts.join(' and ') || 'renamed the board';
    }
    case 'board.deleted':
      return 'deleted the board (it was never issued)';
    case 'board.undeleted':
      return 'undid the delete of the board';
    case 'board.archived':
      return d.site !== undefined
        ? `archived the site “${text(d.site)}” with this board in it`
        : `archived the board at revision ${text(d.revision)}`;
    case 'board.restored':
      return d.site !== undefined
        ? `restored the site “${text(d.site)}” and this board with it`
        : 'restored the board from the archive';
    case 'board.saved':
      return d.newRevision !== undefined
        ? `saved version ${text(d.version)}, starting revision ${text(d.newRevision)} as a draft`
        : `saved version ${text(d.version)}`;
    case 'way.added':
      return `added ${wayRef(entry)}`;
    case 'way.removed':
      return 'removed a way';
    case 'way.moved':
      return `moved ${wayRef(entry)}`;
    case 'way.changed':
      return `changed the device or circuit of ${wayRef(entry)}`;
    case 'board.status':
      return `moved the board from ${statusWord(d.from)} to ${statusWord(d.to)}`;
    case 'board.comment':
      return d.wayId ? `commented on ${wayRef(entry)}` : 'commented on the board';
    case 'label.checked':
      return `checked the label of ${wayRef(entry)}: ${labelWord(d.status)}${
        text(d.note) ? ` (“${text(d.note)}”)` : ''
      }`;
    case 'review.approved': {
      const v = (d.verdicts ?? {}) as Record<string, unknown>;
      const what =
        d.devices !== undefined
          ? ` (${text(d.devices)} devices, ${text(d.circuits)} circuits: ${text(v.passes)} pass, ${text(v.nearLimit)} near the limit, ${text(v.fails)} fail)`
          : '';
      const declared = d.declaration !== undefined ? `, declared as “${text(d.declaration)}”` : '';
      return `approved the board and issued revision ${text(d.revision)}${what}${declared}`;
    }
    case 'comments.answered': {
      const n = Array.isArray(d.commentIds) ? d.commentIds.length : 0;
      return `marked ${n} review comment${n === 1 ? '' : 's'} answered`;
    }
    case 'attachment.withdrawn':
      return 'withdrew a photo from the board (kept with the record)';
    case 'review.returned':
      return `returned revision ${text(d.revision)} for changes`;
    case 'board.verified':
    case 'board.labels-matched':
      return `found every label on site matching revision ${text(d.revision)}`;
    case 'board.unverified':
    case 'board.labels-unmatched':
      return `found a label problem; revision ${text(d.revision)} no longer has every label matched`;
    case 'attachment.added':
      return d.wayId ? `added a photo of ${wayRef(entry)}` : 'added a photo of the board';
    case 'attachment.deleted':
      return 'removed a photo';
    case 'board.supply-origin':
      return 'fed the board from the site’s origin (its typed supply values are kept in its record)';
    case 'board.feed-changed':
      return d.reason === 'way-removed'
        ? 'fed the board from the site’s origin: the way that fed it was removed'
        : d.reason === 'board-removed'
          ? d.self
            ? `let go of the way that fed the board (${text(d.was)}): the board was ${text(d.effect)}`
            : `fed the board from the site’s origin: ${text(d.removedBoard)}, which fed it, was ${text(d.effect)}`
          : d.reason === 'board-returned'
            ? d.kept
              ? `kept the board fed from the site’s origin when ${text(d.returnedBoard)} came back: ${text(d.why)}`
              : `fed the board again from ${text(d.was)}, as before ${text(d.returnedBoard)} was removed`
            : 'changed where the board is fed from';
    case 'board.supply-changed': {
      const n = Array.isArray(d.ways) ? d.ways.length : 0;
      return `changed the supply carried to this board (${text(d.cause) || 'a change upstream'})${
        n ? `: ${n} way${n === 1 ? '' : 's'} changed verdict` : ''
      }`;
    }
    case 'schedule.emailed':
      return `e-mailed the schedule (revision ${text(d.revision)}) to ${text(d.to)}`;
    default:
      return entry.action;
  }
}
