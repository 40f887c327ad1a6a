import type { ScheduleSource } from '@/lib/dal/schedule-source';

/** One PDF to render: a board state as the route read it, and the moment printed on it. */
export type PrintJob = { kind: 'schedule' | 'labels'; source: ScheduleSource; now: string };

/** What a render gives back. */
export type RenderedPdf = { pdf: Uint8Array; fileName: string };
