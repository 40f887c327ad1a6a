'use client';

import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { Camera, ChevronLeft, ChevronRight, ClipboardList } from 'lucide-react';
import Link from 'next/link';
import { useId, useRef, useState } from 'react';
import { toast } from 'sonner';

import { FormAlert } from '@/components/ui/form-alert';
import { LABEL_STATE_LOOKS, LabelStateBadge } from '@/components/ui/label-state-badge';
import { When } from '@/components/ui/when';
import { errorMessage } from '@/lib/api/client';
import { labelChangeUnverifies } from '@/lib/boards/record-rules';
import type { WalkData } from '@/lib/boards/walk-types';
import type { LabelStatus } from '@/lib/domain';
import { LABEL_STATUS_NAMES } from '@/lib/names';

import { fetchWalk, postLabel, uploadPhoto, walkKey } from '../api/walk-api';
import { nextUnchecked, resumeAt } from '../utils/next-way';
import { StateChangeDialog } from './state-change-dialog';
import { WalkSummary } from './walk-summary';

// Every toast of the walk shares one id, so a new one replaces the last instead of stacking
const TOAST_ID = 'label-walk';
const MatchesIcon = LABEL_STATE_LOOKS.matches.icon;
const WrongIcon = LABEL_STATE_LOOKS.wrong.icon;
const MissingIcon = LABEL_STATE_LOOKS.missing.icon;

/** The installer's label walk, for a phone: one way at a time, saved after each one. */
export function LabelWalk({ initial, canRecord }: { initial: WalkData; canRecord: boolean }) {
  const boardId = initial.boardId;
  const queryClient = useQueryClient();
  const fileId = useId();
  const noteId = useId();
  const fileInput = useRef<HTMLInputElement>(null);
  const walk = useQuery({ queryKey: walkKey(boardId), queryFn: () => fetchWalk(boardId), initialData: initial });
  const data = walk.data;
  const [index, setIndex] = useState(() => resumeAt(initial.ways.map((w) => w.status)));
  // A walk with every way checked opens on its summary; the last way checked leads there too
  const [summary, setSummary] = useState(
    () => initial.progress.total > 0 && initial.progress.checked === initial.progress.total,
  );
  const way = data.ways[Math.min(index, data.ways.length - 1)];
  const [notes, setNotes] = useState<Record<string, string>>({});
  const note = notes[way?.id ?? ''] ?? way?.note ?? '';

  // Save one result, reload the walk, and go on to the next way not yet checked
  const record = useMutation({
    mutationFn: ({ status, confirm }: { status: Exclude<LabelStatus, 'unchecked'>; confirm?: boolean }) =>
      postLabel(boardId, way.id, { status, note, ...(confirm ? { confirmStateChange: true } : {}) }),
    onSuccess: async (result) => {
      // staleTime 0: the cached walk is out of date the moment a result is saved
      const fresh = await queryClient.fetchQuery({
        queryKey: walkKey(boardId),
        queryFn: () => fetchWalk(boardId),
        staleTime: 0,
      });
      toast.success(
        result.boardStatus === 'labels-matched'
          ? 'Every label matches the schedule: labels matched on site.'
          : `Saved way ${way.ref ?? way.labelText}.`,
        { id: TOAST_ID },
      );
      if (fresh.progress.checked === fresh.progress.total) setSummary(true);
      else
        setIndex(
          nextUnchecked(
            fresh.ways.map((w) => w.status),
            index,
          ),
        );
    },
  });
  // A check that would take a labels-matched board back to issued asks first (lib/boards/record-rules.ts)
  const [asking, setAsking] = useState<'wrong' | 'missing' | null>(null);
  const choose = (status: Exclude<LabelStatus, 'unchecked'>) => {
    if (status !== 'matches' && labelChangeUnverifies(data.status, status)) setAsking(status);
    else record.mutate({ status });
  };
  const photo = useMutation({
    mutationFn: (file: File) => uploadPhoto(boardId, file, way.id),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: walkKey(boardId) });
      toast.success('Photo added.', { id: TOAST_ID });
    },
    onSettled: () => {
      if (fileInput.current) fileInput.current.value = '';
    },
  });

  if (!way) return <p className="text-sm text-ink-soft">This board has no devices on its rail.</p>;
  const { progress } = data;
  const pct = progress.total ? Math.round((progress.checked / progress.total) * 100) : 0;
  const go = (i: number) => {
    record.reset();
    photo.reset();
    setSummary(false);
    setIndex(Math.max(0, Math.min(data.ways.length - 1, i)));
  };

  return (
    <div className="mx-auto max-w-md space-y-4 pb-10">
      <header className="space-y-1">
        <p className="text-sm text-ink-soft">
          {data.siteName} · revision {data.revision}
        </p>
        <h1 className="text-xl font-semibold">Label walk: {data.name}</h1>
        <div
          role="progressbar"
          aria-label="Ways checked"
          aria-valuemin={0}
          aria-valuemax={progress.total}
          aria-valuenow={progress.checked}
          className="h-2 overflow-hidden rounded-full bg-paper-sunk"
        >
          <div className="h-full bg-copper transition-all" style={{ width: `${pct}%` }} />
        </div>
        <p className="text-sm text-ink" aria-live="polite">
          {progress.checked} of {progress.total} checked · {progress.matches} match
          {progress.wrong ? ` · ${progress.wrong} wrong` : ''}
          {progress.missing ? ` · ${progress.missing} missing` : ''}
        </p>
      </header>

      {data.status === 'labels-matched' ? (
        <p
          role="status"
          className="flex items-center gap-2 rounded-md border border-verdict-pass/40 bg-verdict-pass-bg px-3 py-2 text-sm font-medium text-verdict-pass"
        >
          <MatchesIcon aria-hidden className="h-5 w-5" /> Every label matches the schedule: labels matched on site.
        </p>
      ) : null}

      {summary ? (
        <WalkSummary data={data} onGoTo={(id) => go(data.ways.findIndex((w) => w.id === id))} />
      ) : (
        <section
          aria-labelledby="way-heading"
          className="space-y-3 rounded-card border border-line bg-paper-raised p-4"
        >
          <div className="flex items-start justify-between gap-3">
            <div>
              <p className="text-xs uppercase tracking-wide text-ink-soft">
                {index + 1} of {data.ways.length} on the rail
              </p>
              <h2 id="way-heading" className="text-3xl font-bold tracking-tight">
                {way.ref ? `Way ${way.ref}` : way.device}
              </h2>
            </div>
            <LabelStateBadge status={way.status} />
          </div>
          <div>
            <p className="text-xs text-ink-soft">The label should read</p>
            <p className="text-lg font-semibold leading-snug">{way.labelText}</p>
            {way.stripText ? (
              <p className="mt-1 text-sm text-ink-soft" data-testid="strip-text">
                The printed strip shortens it to fit: <span className="font-medium text-ink">{way.stripText}</span>
              </p>
            ) : null}
            <p className="text-sm text-ink-soft">{way.device}</p>
          </div>
          {way.checkedByName && way.checkedAt ? (
            <p className="text-xs text-ink-soft">
              Checked by {way.checkedByName}, <When iso={way.checkedAt} />
            </p>
          ) : null}

          {canRecord ? (
            <>
              <div className="space-y-1">
                <label htmlFor={noteId} className="text-sm font-medium">
                  Note
                </label>
                <textarea
                  id={noteId}
                  value={note}
                  onChange={(e) => setNotes((n) => ({ ...n, [way.id]: e.target.value }))}
                  rows={2}
                  maxLength={500}
                  placeholder="What the label says, or what is wrong"
                  className="w-full rounded-md border border-line-strong bg-paper px-3 py-2 text-base focus:border-copper focus:outline-none"
                />
              </div>
              <div className="grid gap-2">
                <button
                  type="button"
                  disabled={record.isPending}
                  onClick={() => choose('matches')}
                  className="flex h-16 items-center justify-center gap-2 rounded-lg bg-verdict-pass text-lg font-semibold text-white disabled:opacity-60"
                >
                  <MatchesIcon aria-hidden className="h-6 w-6" /> Label matches
                </button>
                <div className="grid grid-cols-2 gap-2">
                  <button
                    type="button"
                    disabled={record.isPending}
                    onClick={() => choose('wrong')}
                    className="flex h-16 items-center justify-center gap-1.5 rounded-lg border-2 border-verdict-fail bg-verdict-fail-bg px-2 text-sm font-semibold text-verdict-fail disabled:opacity-60"
                  >
                    <WrongIcon aria-hidden className="h-5 w-5" /> Label is wrong
                  </button>
                  <button
                    type="button"
                    disabled={record.isPending}
                    onClick={() => choose('missing')}
                    className="flex h-16 items-center justify-center gap-1.5 rounded-lg border-2 border-verdict-fail bg-verdict-fail-bg px-2 text-sm font-semibold text-verdict-fail disabled:opacity-60"
                  >
                    <MissingIcon aria-hidden className="h-5 w-5" /> Label is missing
                  </button>
                </div>
              </div>
              {record.isPending ? <p className="text-sm text-ink-soft">Saving…</p> : null}
              {record.isError ? <FormAlert>{errorMessage(record.error)}</FormAlert> : null}
            </>
          ) : (
            <p className="text-sm text-ink-soft">Your role can follow the walk but not record it.</p>
          )}

          <div className="space-y-2">
            <h3 className="text-sm font-medium">Photos of this way</h3>
            {way.photos.length ? (
              <ul className="grid grid-cols-3 gap-2">
                {way.photos.map((p) => (
                  <li key={p.id}>
                    <a
                      href={p.url}
                      target="_blank"
                      rel="noreferrer"
                      className="block overflow-hidden rounded-md border border-line"
                    >
                      {/* eslint-disable-next-line @next/next/no-img-element -- served by our own authenticated route */}
                      <img
                        src={p.thumbUrl}
                        alt={`Photo of way ${way.ref ?? way.labelText}: ${p.fileName}`}
                        className="aspect-square w-full object-cover"
                      />
                    </a>
                  </li>
                ))}
              </ul>
            ) : (
              <p className="text-sm text-ink-faint">No photos yet.</p>
            )}
            {canRecord ? (
              <div>
                <label
                  htmlFor={fileId}
                  className="flex h-12 cursor-pointer items-center justify-center gap-2 rounded-lg border border-line-strong bg-paper text-base font-medium"
                >
                  <Camera aria-hidden className="h-5 w-5" /> {photo.isPending ? 'Uploading…' : 'Add a photo'}
                </label>
                <input
                  ref={fileInput}
                  id={fileId}
                  type="file"
                  accept="image/*"
                  capture="environment"
                  className="sr-only"
                  disabled={photo.isPending}
                  onChange={(e) => {
                    const file = e.target.files?.[0];
                    if (file) photo.mutate(file);
                  }}
                />
                {photo.isError ? <FormAlert className="mt-2">{errorMessage(photo.error)}</FormAlert> : null}
              </div>
            ) : null}
          </div>
        </section>
      )}

      <nav aria-label="Ways" className="space-y-2">
        <select
          aria-label="Go to way"
          value={summary ? '' : way.id}
          onChange={(e) => go(data.ways.findIndex((w) => w.id === e.target.value))}
          className="h-12 w-full rounded-lg border border-line-strong bg-paper-raised px-2 text-base"
        >
          {summary ? <option value="">Summary</option> : null}
          {data.ways.map((w) => (
            <option key={w.id} value={w.id}>
              {w.ref ? `Way ${w.ref}` : w.device} · {LABEL_STATUS_NAMES[w.status]}
            </option>
          ))}
        </select>
        <div className="grid grid-cols-2 gap-2">
          <button
            type="button"
            onClick={() => go(summary ? data.ways.length - 1 : index - 1)}
            disabled={!summary && index === 0}
            className="flex h-12 items-center justify-center gap-1 rounded-lg border border-line-strong bg-paper-raised font-medium disabled:opacity-40"
          >
            <ChevronLeft aria-hidden className="h-5 w-5" /> Previous
          </button>
          <button
            type="button"
            onClick={() => (index >= data.ways.length - 1 ? setSummary(true) : go(index + 1))}
            disabled={summary}
            className="flex h-12 items-center justify-center gap-1 rounded-lg border border-line-strong bg-paper-raised font-medium disabled:opacity-40"
          >
            {index >= data.ways.length - 1 && !summary ? 'Summary' : 'Next'}{' '}
            <ChevronRight aria-hidden className="h-5 w-5" />
          </button>
        </div>
        {summary ? null : (
          <button
            type="button"
            onClick={() => setSummary(true)}
            className="flex h-12 w-full items-center justify-center gap-2 rounded-lg border border-line-strong bg-paper-raised font-medium"
          >
            <ClipboardList aria-hidden className="h-5 w-5" /> Finish and see the summary
          </button>
        )}
        <Link
          href={`/boards/${boardId}`}
          className="block py-2 text-center text-sm font-medium text-copper-dark underline-offset-4 hover:underline"
        >
          Back to {data.name}
        </Link>
      </nav>
      <StateChangeDialog
        status={asking}
        wayName={way ? `way ${way.ref ?? way.labelText}` : 'this way'}
        revision={data.revision}
        onClose={() => setAsking(null)}
        onConfirm={() => {
          if (asking) record.mutate({ status: asking, confirm: true });
          setAsking(null);
        }}
      />
    </div>
  );
}
