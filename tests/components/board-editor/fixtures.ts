import crypto from 'node:crypto';

import type { EditorBoard } from '@/features/board-editor/types/draft';
import { demoWays, FLAT_BOARD, WORKSHOP_BOARD } from '@/scripts/demo-data';

/** One of the demo boards as the editor opens it, with fresh ids. */
export function demoBoard(which: 'flat' | 'workshop', version = 3): EditorBoard {
  const demo = which === 'flat' ? FLAT_BOARD : WORKSHOP_BOARD;
  return { id: crypto.randomUUID(), version, status: 'draft', settings: demo.settings, ways: demoWays(demo) };
}
