import type { ScheduleSource } from '@/lib/dal/schedule-source';
import type { SiteResult } from '@/lib/supply';

/** One board document to render: a board state as the route read it, and the moment printed on it. */
export type BoardPrintJob = { kind: 'schedule' | 'labels'; source: ScheduleSource; now: string };

/** The site pack's own pages (the diagram and the values carried to each board) for a sized site. */
export type SitePackJob = { kind: 'site-pack'; site: SiteResult; siteName: string; now: string };

/** One PDF to render in the print pool. */
export type PrintJob = BoardPrintJob | SitePackJob;

/** What a render gives back. */
export type RenderedPdf = { pdf: Uint8Array; fileName: string };
