'use client';

import {
  closestCorners,
  DndContext,
  DragOverlay,
  KeyboardSensor,
  PointerSensor,
  pointerWithin,
  rectIntersection,
  useSensor,
  useSensors,
  type CollisionDetection,
  type DragEndEvent,
  type DragOverEvent,
  type DragStartEvent,
} from '@dnd-kit/core';
import { sortableKeyboardCoordinates } from '@dnd-kit/sortable';
import { useMutation } from '@tanstack/react-query';
import { useEffect, useMemo, useRef, useState } from 'react';
import { toast } from 'sonner';

import { wayLabelMap } from '@/lib/boards/layout';
import { drawRails, railCapacities } from '@/lib/boards/rail';
import type { BoardDto } from '@/lib/boards/types';
import type { FailingWay, ReturnNotes } from '@/lib/boards/review-types';
import type { DeviceOnRail } from '@/lib/sizing';

import { submitForReview } from '../api/board-editor-api';
import { useBoardSave } from '../hooks/use-board-save';
import { clearStoredDraft, readStoredDraft, useDraftPersistence } from '../hooks/use-draft-persistence';
import { LiveSizing } from '../hooks/use-live-sizing';
import { useUndoShortcuts } from '../hooks/use-undo-shortcuts';
import { useBoardDraftStore } from '../stores/board-draft-store';
import { useSaveStore } from '../stores/save-store';
import { boardAnnouncements, SCREEN_READER_INSTRUCTIONS } from '../utils/announcements';
import { deviceWords } from '../utils/device-catalogue';
import { editorBoard } from '../utils/board-shape';
import { wayName } from '../utils/describe';
import { dropProblem, dropTarget, type ActiveData, type OverData } from '../utils/drop-target';
import { newWayId } from '../utils/ids';
import { BinZone } from './bin-zone';
import { BoardSummary } from './board-summary';
import { ConflictDialog } from './conflict-dialog';
import { FeedChangeDialog } from './feed-change-dialog';
import { DeviceFace } from './device-face';
import { DeviceTray } from './device-tray';
import { DrawnBoard } from './drawn-board';
import { EditorToolbar } from './editor-toolbar';
import { ReviewRefusalDialog } from './review-refusal-dialog';
import { ReviewNotes, SelectedWayComments } from './review-notes';
import { SubmitConfirmDialog } from './submit-confirm-dialog';
import { WayPanel } from './way-panel';

/** What the signed-in member may do on this board (the server checks each again). */
type EditorAbilities = { edit: boolean; size: boolean; submit: boolean };

type BoardEditorProps = {
  board: BoardDto;
  can: EditorAbilities;
  /** A returned board's open review comments, shown at the top and beside their ways. */
  reviewNotes?: ReturnNotes | null;
  /** Why the board is read-only whatever the role (e.g. it is archived). */
  readOnlyBecause?: string | null;
};

// A pointer drag uses what is under the pointer (nothing: no target); the keyboard, the nearest zone.
const collision: CollisionDetection = (args) => {
  if (args.pointerCoordinates) {
    const under = pointerWithin(args);
    return under.length ? under : rectIntersection(args);
  }
  return closestCorners(args);
};

/** Removes a way, with a toast whose action undoes it. */
function removeWithUndo(id: string) {
  const { settings, ways, removeWay, undo } = useBoardDraftStore.getState();
  const way = ways.find((w) => w.id === id);
  if (!way || !settings) return;
  const label = wayLabelMap(settings.phases, ways).get(id);
  removeWay(id);
  toast(`Removed ${wayName(way, label)}.`, { action: { label: 'Undo', onClick: () => undo() } });
}

/** Why the dragged device would not fit where it is over, or null. */
function refusalFor(active: ActiveData, over: OverData): string | null {
  const { settings, ways } = useBoardDraftStore.getState();
  if (!settings || !active) return null;
  const target = dropTarget(ways, active.from === 'rail' ? active.wayId : null, over);
  return target?.kind === 'place' ? dropProblem(settings, ways, active, target) : null;
}

// "Add to the board": the first rail with room, at its end (nowhere: the last rail's refusal shows)
function addAnywhere(device: DeviceOnRail) {
  const { settings, ways, addDevice } = useBoardDraftStore.getState();
  if (!settings) return;
  const rails = drawRails(settings.phases, railCapacities(settings.enclosureModules, settings.rails), ways);
  const id = newWayId();
  for (const { rail } of rails) {
    if (addDevice(id, device, rail, ways.filter((w) => w.rail === rail).length).ok) {
      toast.success(
        `Added ${deviceWords(device)} at the end of ${rails.length > 1 ? `rail ${rail + 1}` : 'the rail'}.`,
      );
      return;
    }
  }
}

/** The board editor: its parts wired to the draft store; sizing, saving, the kept draft and undo run in hooks. */
export function BoardEditor({ board, can, reviewNotes = null, readOnlyBecause = null }: BoardEditorProps) {
  const loadedId = useBoardDraftStore((s) => s.boardId);
  const status = useBoardDraftStore((s) => s.status);
  const phases = useBoardDraftStore((s) => s.settings?.phases ?? 1);
  const readOnly = !can.edit || status === 'in-review';
  const ready = loadedId === board.id;

  // Open the board, with the unsaved draft this tab kept (if any)
  useEffect(() => {
    useSaveStore.getState().reset();
    const opened = editorBoard(board);
    const kept = can.edit && board.status !== 'in-review' ? readStoredDraft(board.id) : null;
    useBoardDraftStore.getState().load(opened, kept ?? undefined);
    if (kept && kept.baseVersion !== board.version) {
      // The kept draft was built on an older version: someone saved since
      useBoardDraftStore.getState().rebase(kept.baseVersion);
      useSaveStore.getState().set({
        phase: 'conflict',
        theirVersion: board.version,
        message: 'Your unsaved changes were made before someone else saved this board.',
      });
    } else if (kept) {
      toast.info('Your unsaved changes to this board were kept and are back.');
    }
    return () => {
      useBoardDraftStore.getState().reset();
      useSaveStore.getState().reset();
    };
  }, [board, can.edit]);

  useDraftPersistence(board.id, ready && !readOnly);
  useUndoShortcuts(ready && !readOnly);
  const { save, reloadTheirs, keepMine, confirmFeeds, holdFeeds } = useBoardSave(board.id, ready && !readOnly);

  // Warn before leaving with changes that are not saved (they are kept in the tab anyway)
  useEffect(() => {
    const onBeforeUnload = (event: BeforeUnloadEvent) => {
      if (useBoardDraftStore.getState().dirty) event.preventDefault();
    };
    window.addEventListener('beforeunload', onBeforeUnload);
    return () => window.removeEventListener('beforeunload', onBeforeUnload);
  }, []);

  // Drag state: what is being dragged and whether it would fit where it is
  const [dragging, setDragging] = useState<ActiveData>(undefined);
  const [dropRefusal, setDropRefusal] = useState<string | null>(null);
  const lastDrop = useRef<string | null>(null);
  const announcements = useMemo(
    () =>
      boardAnnouncements(
        () => useBoardDraftStore.getState(),
        // Read when dnd-kit announces a drop, never while rendering
        // eslint-disable-next-line react-hooks/refs
        () => lastDrop.current,
      ),
    [],
  );

  const sensors = useSensors(
    useSensor(PointerSensor, { activationConstraint: { distance: 5 } }),
    useSensor(KeyboardSensor, {
      coordinateGetter: sortableKeyboardCoordinates,
      keyboardCodes: { start: ['Space'], cancel: ['Escape'], end: ['Space', 'Enter'] },
    }),
  );

  const endDrag = () => {
    setDragging(undefined);
    setDropRefusal(null);
  };
  const onDragStart = ({ active }: DragStartEvent) => {
    lastDrop.current = null;
    setDragging(active.data.current as ActiveData);
    setDropRefusal(null);
  };
  const onDragOver = ({ active, over }: DragOverEvent) => {
    setDropRefusal(refusalFor(active.data.current as ActiveData, over?.data.current as OverData));
  };
  const onDragEnd = ({ active, over }: DragEndEvent) => {
    const data = active.data.current as ActiveData;
    const overData = over?.data.current as OverData;
    endDrag();
    lastDrop.current = announcements.describeDrop(data, overData);
    const store = useBoardDraftStore.getState();
    if (!data || readOnly) return;
    const target = dropTarget(store.ways, data.from === 'rail' ? data.wayId : null, overData);
    if (!target) return;
    if (target.kind === 'bin') {
      if (data.from === 'rail') removeWithUndo(data.wayId);
      return;
    }
    if (data.from === 'tray') store.addDevice(newWayId(), data.device, target.rail, target.index);
    else store.moveWay(data.wayId, target.rail, target.index);
  };

  // Sending for review: save first, then ask the server
  const [confirmingSubmit, setConfirmingSubmit] = useState(false);
  const [refusal, setRefusal] = useState<{ message: string; failing: FailingWay[] } | null>(null);
  const sendForReview = useMutation({
    mutationFn: async () => {
      if (useBoardDraftStore.getState().dirty && !(await save())) {
        throw new Error('Save the board first; it could not be saved just now.');
      }
      return submitForReview(board.id, useBoardDraftStore.getState().baseVersion);
    },
    onSuccess: (outcome) => {
      if (outcome.kind === 'sent') {
        clearStoredDraft(board.id);
        useBoardDraftStore.getState().load(editorBoard(outcome.board));
        toast.success('Sent for review. The inspectors have been e-mailed.');
      } else if (outcome.kind === 'refused') {
        setRefusal({ message: outcome.message, failing: outcome.failing });
      } else {
        toast.error(outcome.message);
      }
    },
    onError: (err) => toast.error(err.message),
  });

  const savePhase = useSaveStore((s) => s.phase);
  const feedChanges = useSaveStore((s) => s.feedChanges);
  const saveMessage = useSaveStore((s) => s.message);
  // The conflict dialog, once closed, stays closed for that conflict (their version) only
  const theirVersion = useSaveStore((s) => s.theirVersion);
  const [hiddenFor, setHiddenFor] = useState<number | null | undefined>(undefined);
  const conflictHidden = hiddenFor === theirVersion;

  if (!ready) {
    return (
      <div aria-busy="true" className="rounded-card border border-line bg-paper-raised p-6 text-sm text-ink-soft">
        Opening the board…
      </div>
    );
  }

  const readOnlyReason = readOnlyBecause
    ? readOnlyBecause
    : !can.edit
      ? `Read only: your role may ${can.size ? 'look at the board and its sizing' : 'look at the board'}, not change it.`
      : status === 'in-review'
        ? 'In review: the board can be changed again once the inspector returns it.'
        : null;

  return (
    <LiveSizing boardId={board.id} enabled={ready && can.size}>
      <DndContext
        sensors={sensors}
        collisionDetection={collision}
        onDragStart={onDragStart}
        onDragOver={onDragOver}
        onDragEnd={onDragEnd}
        onDragCancel={endDrag}
        accessibility={{ announcements, screenReaderInstructions: SCREEN_READER_INSTRUCTIONS }}
      >
        <EditorToolbar
          siteName={board.siteName}
          canEdit={!readOnly}
          canSubmit={can.submit && status === 'draft'}
          readOnlyReason={readOnlyReason}
          submitting={sendForReview.isPending}
          onSave={() => void save()}
          onSubmit={() => setConfirmingSubmit(true)}
        />
        {reviewNotes ? <ReviewNotes boardId={board.id} notes={reviewNotes} canAnswer={can.edit} /> : null}
        <div className="grid grid-cols-1 gap-4 xl:grid-cols-[minmax(0,1fr)_400px]">
          <div className="min-w-0 space-y-3">
            {!readOnly ? <DeviceTray boardPhases={phases} onAdd={addAnywhere} /> : null}
            <Notice />
            <DrawnBoard
              readOnly={readOnly}
              showVerdicts={can.size}
              dropRefusal={dropRefusal}
              onRemove={removeWithUndo}
              derivedSupply={board.derivedSupply}
            />
            {!readOnly ? (
              <div className="flex items-center justify-between gap-3">
                <p className="text-xs text-ink-faint">
                  Drag to move a way along or between rails. Keyboard: Tab to a device, Space to pick it up, arrows to
                  move, Space to put it down.
                </p>
                <BinZone dragging={dragging?.from === 'rail'} />
              </div>
            ) : null}
            {can.size ? <BoardSummary /> : null}
          </div>
          <div className="xl:sticky xl:top-4 xl:max-h-[calc(100vh-2rem)] xl:self-start xl:overflow-y-auto">
            {reviewNotes ? <SelectedWayComments notes={reviewNotes} /> : null}
            <WayPanel readOnly={readOnly} showSizing={can.size} onRemove={removeWithUndo} />
          </div>
        </div>
        <DragOverlay dropAnimation={null}>
          {dragging ? <DragPreview data={dragging} refusal={dropRefusal} /> : null}
        </DragOverlay>
        <ConflictDialog
          open={savePhase === 'conflict' && !conflictHidden}
          message={saveMessage}
          onReloadTheirs={() => void reloadTheirs()}
          onKeepMine={() => void keepMine()}
          onClose={() => setHiddenFor(theirVersion)}
        />
        <FeedChangeDialog
          feedChanges={savePhase === 'feeds' ? feedChanges : null}
          onConfirm={() => void confirmFeeds()}
          onHold={holdFeeds}
        />
        <SubmitConfirmDialog
          open={confirmingSubmit}
          revision={board.revision}
          onClose={() => setConfirmingSubmit(false)}
          onConfirm={() => {
            setConfirmingSubmit(false);
            sendForReview.mutate();
          }}
        />
        <ReviewRefusalDialog
          refusal={refusal}
          onClose={() => setRefusal(null)}
          onShowWays={(ids) => {
            useBoardDraftStore.getState().selectMany(ids);
            setRefusal(null);
          }}
        />
      </DndContext>
    </LiveSizing>
  );
}

/** The last refusal, in words, where the designer is looking (and read out). */
function Notice() {
  const notice = useBoardDraftStore((s) => s.notice);
  const clear = useBoardDraftStore((s) => s.clearNotice);
  if (!notice) return <div aria-live="assertive" className="sr-only" />;
  return (
    <div
      role="alert"
      data-testid="editor-notice"
      className="flex items-start justify-between gap-3 rounded-md border border-verdict-fail/30 bg-verdict-fail-bg px-3 py-2 text-sm text-verdict-fail"
    >
      <span>
        <strong className="font-semibold">Does not fit.</strong> {notice.message}
      </span>
      <button type="button" onClick={clear} className="text-xs underline">
        Dismiss
      </button>
    </div>
  );
}

/** What follows the pointer while dragging: the device, and why it would not fit, if so. */
function DragPreview({ data, refusal }: { data: NonNullable<ActiveData>; refusal: string | null }) {
  const ways = useBoardDraftStore((s) => s.ways);
  const device = data.from === 'tray' ? data.device : ways.find((w) => w.id === data.wayId)?.device;
  if (!device) return null;
  return (
    <div className="pointer-events-none flex items-start gap-2">
      <div className="h-[100px] shadow-lg" style={{ width: device.modules * 28 }}>
        <DeviceFace device={device} />
      </div>
      {refusal ? (
        <p className="max-w-64 rounded-md border border-verdict-fail/40 bg-verdict-fail-bg px-2 py-1 text-xs text-verdict-fail shadow">
          Does not fit here. {refusal}
        </p>
      ) : null}
    </div>
  );
}
