'use client';

import Link from 'next/link';
import { CloudOff, Loader2, Redo2, Save, Send, Undo2 } from 'lucide-react';

import { Button } from '@/components/ui/button';
import { StatusBadge } from '@/components/ui/status-badge';
import { cn } from '@/lib/cn';

import { useBoardDraftStore } from '../stores/board-draft-store';
import { useSaveStore } from '../stores/save-store';

type EditorToolbarProps = {
  siteName: string;
  canEdit: boolean;
  canSubmit: boolean;
  readOnlyReason: string | null;
  submitting: boolean;
  onSave: () => void;
  onSubmit: () => void;
};

/** Saving state in words: what the designer needs to know about their changes. */
function SaveState() {
  const dirty = useBoardDraftStore((s) => s.dirty);
  const phase = useSaveStore((s) => s.phase);
  const message = useSaveStore((s) => s.message);
  let text = dirty ? 'Unsaved changes (kept in this browser)' : 'All changes saved';
  let tone = dirty ? 'text-ink-soft' : 'text-verdict-pass';
  if (phase === 'saving') [text, tone] = ['Saving…', 'text-ink-soft'];
  if (phase === 'failed') [text, tone] = [message ?? 'Saving failed.', 'text-verdict-fail'];
  if (phase === 'conflict')
    [text, tone] = ['Saved elsewhere meanwhile: choose which copy to keep', 'text-verdict-near'];
  if (phase === 'feeds')
    [text, tone] = ['Not saved yet: other boards are fed from a way you took away', 'text-verdict-near'];
  if (phase === 'idle' && dirty && message) [text, tone] = [message, 'text-verdict-near'];
  if (phase === 'locked') [text, tone] = [message ?? 'This board cannot be saved now.', 'text-verdict-near'];
  return (
    <span
      role="status"
      data-testid="save-state"
      data-phase={phase}
      data-dirty={dirty}
      className={cn('inline-flex items-center gap-1 text-xs', tone)}
    >
      {phase === 'saving' ? <Loader2 aria-hidden className="h-3.5 w-3.5 animate-spin" /> : null}
      {phase === 'failed' ? <CloudOff aria-hidden className="h-3.5 w-3.5" /> : null}
      {text}
    </span>
  );
}

/** The editor's top bar: the board, its status and saving state, undo and redo, rails, save and send. */
export function EditorToolbar(props: EditorToolbarProps) {
  const { siteName, canEdit, canSubmit, readOnlyReason, submitting, onSave, onSubmit } = props;
  const settings = useBoardDraftStore((s) => s.settings);
  const status = useBoardDraftStore((s) => s.status);
  const canUndo = useBoardDraftStore((s) => s.past.length > 0);
  const canRedo = useBoardDraftStore((s) => s.future.length > 0);
  const undo = useBoardDraftStore((s) => s.undo);
  const redo = useBoardDraftStore((s) => s.redo);
  const setRails = useBoardDraftStore((s) => s.setRails);
  const dirty = useBoardDraftStore((s) => s.dirty);
  const phase = useSaveStore((s) => s.phase);
  if (!settings) return null;
  return (
    <div className="mb-4 flex flex-wrap items-end justify-between gap-3">
      <div className="min-w-0">
        <div className="text-sm text-ink-soft">
          <Link href="/boards" className="hover:text-ink hover:underline">
            Boards
          </Link>{' '}
          / {siteName}
        </div>
        <div className="flex flex-wrap items-center gap-2">
          <h1 className="text-2xl font-semibold tracking-tight text-ink">{settings.name}</h1>
          <StatusBadge status={status} />
        </div>
        <div className="mt-0.5 flex flex-wrap items-center gap-3">
          {readOnlyReason ? <span className="text-xs text-ink-soft">{readOnlyReason}</span> : <SaveState />}
        </div>
      </div>
      {canEdit ? (
        <div className="flex flex-wrap items-center gap-2">
          <Button
            variant="secondary"
            size="sm"
            onClick={undo}
            disabled={!canUndo}
            aria-keyshortcuts="Control+Z"
            title="Undo (Ctrl+Z)"
          >
            <Undo2 aria-hidden className="h-4 w-4" /> Undo
          </Button>
          <Button
            variant="secondary"
            size="sm"
            onClick={redo}
            disabled={!canRedo}
            aria-keyshortcuts="Control+Shift+Z Control+Y"
            title="Redo (Ctrl+Shift+Z)"
          >
            <Redo2 aria-hidden className="h-4 w-4" /> Redo
          </Button>
          <label className="flex items-center gap-1.5 text-xs text-ink-soft">
            Rails
            <select
              value={settings.rails}
              onChange={(e) => setRails(Number(e.target.value))}
              className="h-8 rounded-md border border-line-strong bg-paper-raised px-2 text-xs text-ink"
            >
              {[1, 2, 3, 4].map((n) => (
                <option key={n}>{n}</option>
              ))}
            </select>
          </label>
          <Button
            variant="secondary"
            size="sm"
            onClick={onSave}
            disabled={!dirty || phase === 'saving' || phase === 'conflict'}
          >
            <Save aria-hidden className="h-4 w-4" /> Save
          </Button>
          {canSubmit ? (
            <Button size="sm" onClick={onSubmit} disabled={submitting || phase === 'conflict'}>
              <Send aria-hidden className="h-4 w-4" /> {submitting ? 'Sending…' : 'Send for review'}
            </Button>
          ) : null}
        </div>
      ) : null}
    </div>
  );
}
