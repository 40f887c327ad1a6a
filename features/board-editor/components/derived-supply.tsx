'use client';

import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { ArrowRight, Cable } from 'lucide-react';
import Link from 'next/link';
import { useId, useState } from 'react';

import { FeedSelect } from '@/components/site-diagram/feed-select';
import { SelectivityList } from '@/components/site-diagram/selectivity-list';
import { siteTreeKey, useSiteTree } from '@/components/site-diagram/site-tree-query';
import { boardsBelow, feedOfKey, feedWords, sameFeed, type FeedChoice } from '@/components/site-diagram/tree-model';
import { VerdictBadge } from '@/components/sizing/verdict-badge';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { apiFetch } from '@/lib/api/client';
import type { AuditPage } from '@/lib/audit-types';
import type { BoardDto } from '@/lib/boards/schemas';
import type { Verdict } from '@/lib/sizing';
import { EARTHING_NAMES, fedFromWords, plural } from '@/lib/names';
import { amps, ka, ohm, pct } from '@/lib/sites/supply-words';
import type { CarriedValue, DerivedSupply as Derived, SiteTreeDto } from '@/lib/sites/tree-types';

type DerivedSupplyProps = {
  board: Pick<
    BoardDto,
    'id' | 'siteId' | 'siteName' | 'feed' | 'derivedSupply' | 'supply' | 'version' | 'status' | 'revision'
  >;
  /** Whether the member may change where the board is fed from (the server checks again). */
  canEdit: boolean;
};

type ChangedWay = { wayId: string; way: string | null; before: Verdict | null; after: Verdict | null };
type SupplyChange = {
  at: string;
  cause: string;
  ways: ChangedWay[];
  /** Newer than the board's last issue (its approval), or no approval as new as it (none on the page). */
  afterLastIssue: boolean;
};

/** The newest "supply changed" record of the board's history, with the ways whose verdict moved. */
function latestSupplyChange(page: AuditPage): SupplyChange | null {
  const at = page.entries.findIndex((e) => e.action === 'board.supply-changed');
  if (at < 0) return null;
  const entry = page.entries[at];
  const ways = Array.isArray(entry.details.ways) ? (entry.details.ways as ChangedWay[]) : [];
  const cause = typeof entry.details.cause === 'string' ? entry.details.cause : 'A change upstream';
  // Newest first: an approval after it comes before it in the page
  const issued = page.entries.findIndex((e) => e.action === 'review.approved');
  return { at: entry.createdAt, cause, ways, afterLastIssue: issued < 0 || at < issued };
}

/**
 * Whether the supply carried to an issued board changed after it was issued. The issued revision
 * stays as it was (nobody changed this board, and a revision is a fixed record), so its status
 * does not move; but the schedule in the board door shows the values at issue, so the designer is
 * told, to decide whether to start the next revision.
 */
const changedSinceIssue = (status: BoardDto['status'], change: SupplyChange | null) =>
  (status === 'issued' || status === 'labels-matched') && !!change?.afterLastIssue;

/** What the tree carried to this board, in the shape the board's own record keeps it. */
function derivedOf(tree: SiteTreeDto | undefined, boardId: string): Derived | null {
  const b = tree?.boards.find((x) => x.boardId === boardId);
  if (!tree || !b?.supply || (!b.fedFrom && !tree.origin)) return null;
  return { ...b, supply: b.supply, from: b.fedFrom ? 'way' : 'origin', treeVersion: tree.treeVersion };
}

/**
 * Where the board's supply comes from, with the values carried down to it (greyed: derived,
 * each with its working on hover or focus). An editor may choose the feeding way here (asked
 * first); after a change upstream it says which ways changed verdict (from the board's history).
 */
export function DerivedSupply({ board, canEdit }: DerivedSupplyProps) {
  const queryClient = useQueryClient();
  const selectId = useId();
  const [pending, setPending] = useState<FeedChoice | null>(null);
  const tree = useSiteTree(board.siteId);
  const history = useQuery({
    queryKey: ['boards', board.id, 'supply-change'],
    // Only the supply changes and the approvals: the newest of each are on this one page however
    // long the history since (a walk alone writes an event per label)
    queryFn: () =>
      apiFetch<AuditPage>(
        `/api/boards/${encodeURIComponent(board.id)}/audit?actions=board.supply-changed,review.approved`,
      ),
    select: latestSupplyChange,
  });
  const setFeed = useMutation({
    mutationFn: (feed: FeedChoice) =>
      apiFetch(`/api/boards/${encodeURIComponent(board.id)}/feed`, {
        method: 'PUT',
        body: { feed, confirmFeedChanges: true },
      }),
    // The carried values are read with the board: load the page again
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: siteTreeKey(board.siteId) });
      window.location.reload();
    },
  });

  const boards = tree.data?.boards ?? [];
  // The tree is sized on every read, so its values are the current ones; until it has loaded,
  // what was stored with the board's sizing
  const derived = derivedOf(tree.data, board.id) ?? board.derivedSupply;
  const change = history.data ?? null;
  const below = boardsBelow(boards, board.id).map((b) => b.name);
  // The judgements between the sub-main's device and this board's devices (the tree sizes them)
  const selectivity = boards.find((b) => b.boardId === board.id)?.selectivity ?? [];

  return (
    <section
      aria-labelledby={`${selectId}-title`}
      className="rounded-card border border-line bg-paper-raised p-4 text-sm"
      data-testid="derived-supply"
    >
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id={`${selectId}-title`} className="text-base font-semibold text-ink">
          Supply
        </h2>
        <Link href={`/sites/${board.siteId}`} className="text-xs text-ink-soft underline hover:text-ink">
          {board.siteName}: supply tree
        </Link>
      </div>
      <SupplyWords derived={derived} typed={board.supply} />
      {derived && derived.from === 'way' ? <CarriedValues derived={derived} /> : null}
      {selectivity.length ? <SelectivityList groups={selectivity} className="mt-3 text-xs text-ink-soft" /> : null}
      {changedSinceIssue(board.status, change) ? (
        <p
          role="note"
          className="mt-3 rounded-md border border-copper/40 bg-copper-light/40 p-3 text-ink"
          data-testid="supply-changed-since-issue"
        >
          <strong>Supply changed since issue.</strong> {change!.cause} after revision {board.revision} was issued, so
          the printed schedule shows the values carried at issue. Save the board to start revision {board.revision + 1}{' '}
          and send it for review if the change matters.
        </p>
      ) : null}
      {change && change.ways.length > 0 ? (
        <div className="mt-3 rounded-md border border-copper/40 bg-copper-light/40 p-3" data-testid="supply-change">
          <p className="font-medium text-ink">
            {change.cause}: {plural(change.ways.length, 'way')} changed verdict
          </p>
          <ul className="mt-1 flex flex-col gap-1">
            {change.ways.map((w) => (
              <li key={w.wayId} className="flex flex-wrap items-center gap-2" data-changed-way={w.wayId}>
                <span className="text-ink">{w.way ?? 'A way'}</span>
                {w.before ? <VerdictBadge verdict={w.before} /> : <span className="text-ink-soft">not sized</span>}
                <ArrowRight aria-label="became" className="h-3.5 w-3.5 text-ink-soft" />
                {w.after ? <VerdictBadge verdict={w.after} /> : <span className="text-ink-soft">not sized</span>}
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      {canEdit && tree.data ? (
        <FeedSelect
          id={selectId}
          boards={boards}
          boardId={board.id}
          value={board.feed}
          disabled={setFeed.isPending}
          onChange={(key) => {
            const feed = feedOfKey(key);
            if (sameFeed(feed, board.feed)) return;
            setFeed.reset();
            setPending(feed);
          }}
        />
      ) : null}
      {pending ? (
        <ConfirmDialog
          open
          danger={false}
          title="Feed this board from elsewhere?"
          confirmLabel="Change the feed"
          pending={setFeed.isPending}
          error={setFeed.error?.message ?? null}
          onClose={() => setPending(null)}
          onConfirm={() => setFeed.mutate(pending)}
        >
          <p>
            Fed from {feedWords(boards, board.feed)} now; from {feedWords(boards, pending)} after this.
          </p>
          <p className="mt-2">
            {below.length
              ? `The supply values of this board and of ${below.join(', ')} below it change, and each is sized again.`
              : 'The supply values of this board change, and it is sized again with them.'}
          </p>
        </ConfirmDialog>
      ) : null}
    </section>
  );
}

function SupplyWords({ derived, typed }: { derived: Derived | null; typed: BoardDto['supply'] }) {
  if (!derived) {
    return (
      <p className="mt-1 text-ink-soft">
        Typed on this board: {EARTHING_NAMES[typed.earthing] ?? typed.earthing}, Ze {ohm(typed.zeOhm)}, PFC{' '}
        {ka(typed.pfcKa)} (the site&apos;s origin is not given yet).
      </p>
    );
  }
  if (derived.from === 'origin') {
    const s = derived.supply;
    return (
      <p className="mt-1 text-ink-soft">
        Fed from the site&apos;s origin (supply intake): {EARTHING_NAMES[s.earthing] ?? s.earthing}, Uo {s.uoV} V, Ze{' '}
        {ohm(s.zeOhm)}, PFC {ka(s.pfcKa)}.
      </p>
    );
  }
  return (
    <div className="mt-1">
      <p className="flex items-center gap-2 font-medium text-ink">
        <Cable aria-hidden className="h-4 w-4 text-ink-soft" />
        Fed from {fedFromWords(derived.fedFrom)}
        {derived.phase ? `, on ${derived.phase}` : ''}
      </p>
      {derived.fedFrom ? (
        <p className="mt-0.5 text-xs text-ink-soft">
          Sub-main: {derived.fedFrom.device}, {derived.fedFrom.cable}.{' '}
          <Link href={`/boards/${derived.fedFrom.boardId}`} className="underline hover:text-ink">
            Open {derived.fedFrom.boardName}
          </Link>
        </p>
      ) : null}
      {derived.problem ? <p className="mt-1 text-verdict-fail">{derived.problem}</p> : null}
    </div>
  );
}

function CarriedValues({ derived }: { derived: Derived }) {
  const values: { key: string; name: string; unit: (x: number) => string; value: CarriedValue | null }[] = [
    { key: 'zdb', name: 'Zdb', unit: ohm, value: derived.zdb },
    { key: 'pfc', name: 'PFC', unit: ka, value: derived.pfc },
    { key: 'vd', name: 'Volt drop used above', unit: pct, value: derived.vdUsed },
    { key: 'ib', name: 'Sub-main design current', unit: amps, value: derived.subMainCurrent },
  ];
  return (
    <dl className="mt-3 grid grid-cols-2 gap-2 sm:grid-cols-4" aria-label="Values carried down to this board (derived)">
      {values.map((v) => (
        <CarriedStat key={v.key} name={v.name} words={v.value ? v.unit(v.value.value) : '–'} value={v.value} />
      ))}
    </dl>
  );
}

/**
 * One derived value, greyed, with its working shown while it is hovered or focused. The working
 * takes no room while hidden (a hidden box still widened a phone's page) and opens towards the
 * middle from a value in the right-hand column.
 */
function CarriedStat({ name, words, value }: { name: string; words: string; value: CarriedValue | null }) {
  const id = useId();
  return (
    <div className="group relative">
      <dt className="text-xs text-ink-soft">{name}</dt>
      <dd
        tabIndex={value ? 0 : undefined}
        aria-describedby={value ? id : undefined}
        data-derived
        className="mt-0.5 rounded bg-paper-sunk px-2 py-1 font-medium text-ink-soft focus-visible:outline-2 focus-visible:outline-copper"
      >
        {words}
        <span className="sr-only"> (derived)</span>
      </dd>
      {value ? (
        <div
          id={id}
          role="tooltip"
          className="absolute top-full left-0 z-20 mt-1 hidden w-72 max-w-[calc(100vw-2rem)] rounded-md border border-line-strong bg-paper-raised p-3 text-xs text-ink shadow-lg group-even:right-0 group-even:left-auto group-focus-within:block group-hover:block"
        >
          <p>{value.working.text}</p>
          {value.working.steps.length ? (
            <ol className="mt-1 list-decimal pl-4 font-mono text-[11px]">
              {value.working.steps.map((s, i) => (
                <li key={i}>{s}</li>
              ))}
            </ol>
          ) : null}
          {value.working.sources.length ? (
            <p className="mt-1 text-ink-soft">Sources: {value.working.sources.join('; ')}</p>
          ) : null}
        </div>
      ) : null}
    </div>
  );
}
