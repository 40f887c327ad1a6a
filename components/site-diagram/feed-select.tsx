'use client';

import { Select } from '@/components/ui/field';

import { boardFedBy, feedKey, feedOptions, feedWayWords, type FeedChoice, type TreeBoard } from './tree-model';

type FeedSelectProps = {
  id: string;
  boards: readonly TreeBoard[];
  boardId: string;
  value: FeedChoice;
  disabled?: boolean;
  onChange: (feed: string) => void;
};

/**
 * The choice of where a board is fed from, labelled "Fed from": the origin, or a distribution way
 * of another board of the site, grouped by board. The keyboard's (and a screen reader's) way of
 * linking boards; the site view also lets a board be dragged onto a way.
 */
export function FeedSelect({ id, boards, boardId, value, disabled, onChange }: FeedSelectProps) {
  const groups = feedOptions(boards, boardId);
  return (
    <div className="mt-3 flex flex-col gap-1">
      <label htmlFor={id} className="text-xs font-medium text-ink">
        Fed from
      </label>
      <Select id={id} value={feedKey(value)} disabled={disabled} onChange={(e) => onChange(e.target.value)}>
        <option value="origin">The origin (supply intake)</option>
        {groups.map((g) => (
          <optgroup key={g.boardId} label={g.boardName}>
            {g.ways.map((w) => {
              const feeds = w.feedsBoardId && w.feedsBoardId !== boardId ? boardFedBy(boards, w) : null;
              return (
                <option key={w.id} value={`${g.boardId}:${w.id}`}>
                  {`${g.boardName}, ${feedWayWords(w)}${feeds ? ` (feeds ${feeds} now)` : ''}`}
                </option>
              );
            })}
          </optgroup>
        ))}
      </Select>
    </div>
  );
}
