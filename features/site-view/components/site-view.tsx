'use client';

import { useState } from 'react';

import { SiteDiagram } from '@/components/site-diagram/site-diagram';
import { useSiteTree } from '@/components/site-diagram/site-tree-query';
import { sameFeed, type FeedChoice } from '@/components/site-diagram/tree-model';
import { Caution } from '@/components/ui/caution';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { ErrorState } from '@/components/ui/error-state';

import { useSetFeed } from '../api/use-site-tree';
import { repointWords, type PendingFeed } from '../utils/repoint';
import { BoardFeeds } from './board-feeds';
import { OriginPanel } from './origin-panel';
import { SitePackActions } from './site-pack-actions';

type SiteViewProps = {
  siteId: string;
  siteName: string;
  /** Whether the member may link boards (the server checks again). */
  canLink: boolean;
  /** Whether the member may print the site pack (it prints drafts; the server checks again). */
  canPrint?: boolean;
};

/**
 * The site as one supply tree: the single-line diagram (each board a link to its editor) and
 * beside it (below it on a phone) the same tree as a list, where a designer links boards by
 * choosing a feeding way or by dragging a board onto one. A change of feed is asked about
 * first, naming every board whose supply values change; a refusal (a loop, a way that already
 * feeds a board) shows the server's message.
 */
export function SiteView({ siteId, siteName, canLink, canPrint = false }: SiteViewProps) {
  const query = useSiteTree(siteId);
  const setFeed = useSetFeed(siteId);
  const [pending, setPending] = useState<PendingFeed | null>(null);
  const view = query.data;

  const pick = (boardId: string, feed: FeedChoice) => {
    const board = view?.boards.find((b) => b.boardId === boardId);
    if (!board || sameFeed(board.feed, feed)) return;
    setFeed.reset();
    setPending({ boardId, feed });
  };
  const words = view && pending ? repointWords(view.boards, pending) : null;

  return (
    <section aria-labelledby="supply-tree" className="mb-8 flex flex-col gap-4">
      <div className="flex flex-col gap-1">
        <h2 id="supply-tree" className="text-lg font-semibold text-ink">
          Supply tree
        </h2>
        <p className="text-sm text-ink-soft">
          The origin feeds each board directly or through a sub-main from another board; the values at each board are
          carried down from the boards above it. Open a board from the diagram or the list.
        </p>
      </div>
      <Caution />
      {view ? <OriginPanel siteId={siteId} origin={view.origin} canEdit={canLink} /> : null}
      {query.isError ? (
        <ErrorState
          title="The supply tree could not be loaded"
          message={query.error.message}
          onRetry={() => void query.refetch()}
          retrying={query.isFetching}
        />
      ) : !view ? (
        <p className="text-sm text-ink-soft" role="status">
          Loading the supply tree…
        </p>
      ) : (
        <div className="grid gap-6 xl:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
          <figure className="min-w-0">
            <figcaption className="mb-2 text-sm font-medium text-ink">Single-line diagram</figcaption>
            <div className="overflow-x-auto rounded-card border border-line bg-paper p-2" data-testid="site-diagram">
              <SiteDiagram site={view} siteName={siteName} hrefOf={(id) => `/boards/${id}`} className="min-w-[22rem]" />
            </div>
          </figure>
          <div className="min-w-0">
            <h3 className="mb-2 text-sm font-medium text-ink">Boards and their feeds</h3>
            <BoardFeeds boards={view.boards} canLink={canLink} onPick={pick} busy={setFeed.isPending} />
          </div>
        </div>
      )}
      {words && pending ? (
        <ConfirmDialog
          open
          danger={false}
          title={words.title}
          confirmLabel="Change the feed"
          pending={setFeed.isPending}
          error={setFeed.error?.message ?? null}
          onClose={() => setPending(null)}
          onConfirm={() => setFeed.mutate(pending, { onSuccess: () => setPending(null) })}
        >
          <p>
            Fed from {words.now} now; from {words.after} after this.
          </p>
          <p className="mt-2">{words.summary}</p>
          {words.changes.length > 1 ? (
            <ul className="mt-2 list-disc pl-5" aria-label="Boards that change">
              {words.changes.map((n) => (
                <li key={n}>{n}</li>
              ))}
            </ul>
          ) : null}
        </ConfirmDialog>
      ) : null}
      {/* After the tree, so that printing the whole site never pushes the tree itself down */}
      {canPrint ? <SitePackActions siteId={siteId} /> : null}
    </section>
  );
}
