'use client';

import { SelectivityList } from '@/components/site-diagram/selectivity-list';
import { useSiteTree } from '@/components/site-diagram/site-tree-query';
import { nearLimitBySelectivityOnly } from '@/components/site-diagram/tree-model';
import { errorMessage } from '@/lib/api/client';

import { useInBrowser } from '@/lib/use-in-browser';

/**
 * A board fed from another board: the judgements of selectivity between its sub-main's device and
 * its own devices (advisory), as the site view and the editor's Supply panel state them, so that
 * the inspector sees why the site marks the board near the limit when every way passes. Read
 * from the site's tree in the browser (the server sizes the tree on every read; the page itself
 * stays as light as it was).
 */
export function ReviewSelectivity({ siteId, boardId }: { siteId: string; boardId: string }) {
  const inBrowser = useInBrowser();
  const tree = useSiteTree(siteId, { enabled: inBrowser });
  if (tree.isError) {
    return (
      <p className="text-xs text-ink-soft">
        The selectivity below the sub-main could not be read: {errorMessage(tree.error)}
      </p>
    );
  }
  if (!inBrowser || tree.isPending) {
    return <p className="text-xs text-ink-soft">Reading the selectivity below the sub-main…</p>;
  }
  const board = tree.data.boards.find((b) => b.boardId === boardId);
  if (!board?.selectivity.length) return null;
  return (
    <div data-testid="review-selectivity">
      {nearLimitBySelectivityOnly(board) ? (
        <p className="text-xs text-ink">
          The site marks this board near the limit through this selectivity alone (advisory); every way passes.
        </p>
      ) : null}
      <SelectivityList groups={board.selectivity} className="mt-1 text-xs text-ink-soft" />
    </div>
  );
}
