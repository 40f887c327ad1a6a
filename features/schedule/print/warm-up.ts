import type { SnapshotWay } from '@/lib/boards/revision-diff';
import { boardSizingInput } from '@/lib/boards/sizing-input';
import type { ScheduleSource } from '@/lib/dal/schedule-source';
import { boardInputSchema, sizeBoard } from '@/lib/sizing';
import { sizeSite, type SiteResult } from '@/lib/supply';

const te = { phases: 1, cable: 'te-70', method: 'C', ambientC: 30, insulationMm: 0, csaMm2: null } as const;
const mcb = (ratingA: number) => ({ kind: 'mcb', poles: 1, modules: 1, curve: 'B', ratingA, breakingKa: 6 }) as const;

/**
 * A small invented board (a main switch, an RCD, a lighting and a socket circuit, a spare)
 * that a new print thread renders before its first real print: loading react-pdf, the fonts
 * and the schedule's code and warming them takes a new thread seconds, which the first print
 * after a server start would otherwise wait for. Its PDF is thrown away.
 */
export function warmUpSource(): ScheduleSource {
  const ways: SnapshotWay[] = [
    { id: 'm', device: { kind: 'main-switch', poles: 2, modules: 2, ratingA: 100 }, circuit: null },
    { id: 'r', device: { kind: 'rcd', poles: 2, modules: 2, ratingA: 63, rcdMa: 30, rcdType: 'A' }, circuit: null },
    {
      id: 'l',
      device: mcb(6),
      circuit: {
        ...te,
        serves: 'Lights',
        use: 'lighting',
        load: { kind: 'known', watts: 300, powerFactor: 1 },
        lengthM: 15,
      },
    },
    {
      id: 's',
      device: mcb(32),
      circuit: {
        ...te,
        serves: 'Sockets',
        use: 'sockets',
        load: { kind: 'known', watts: 3000, powerFactor: 1 },
        lengthM: 25,
      },
    },
    { id: 'x', device: { kind: 'blank', poles: 1, modules: 1 }, circuit: null },
  ].map((w, position) => ({ ...w, rail: 0, position }) as SnapshotWay);
  const settings: ScheduleSource['snapshot']['settings'] = {
    name: 'Print warm-up',
    location: '',
    phases: 1,
    supply: { earthing: 'TN-C-S', uoV: 230, zeOhm: 0.35, pfcKa: 6, source: 'public' },
    incoming: { kind: 'main-switch', ratingA: 100 },
    enclosureModules: 12,
    rails: 1,
    dwelling: true,
  };
  return {
    boardId: 'warm-up',
    boardUrl: 'http://localhost/boards/warm-up',
    snapshot: { settings, siteName: 'Warm-up', organisationName: 'Boardwright', ways },
    sizing: sizeBoard(boardInputSchema.parse(boardSizingInput(settings, ways))),
    sizingIssues: [],
    revision: 1,
    status: 'issued',
    frozen: true,
    issued: { at: new Date().toISOString(), byName: 'Boardwright' },
    labels: null,
    updatedAt: new Date().toISOString(),
  };
}

/**
 * The warm-up board as a site of one board fed from the origin, sized by the tree's engine: the
 * site pack's own pages (the diagram and the carried values) are rendered from it once, so the
 * first site pack after a server start does not wait for their code to load and warm.
 */
export function warmUpSite(source: ScheduleSource): SiteResult {
  const { settings, ways } = source.snapshot;
  const { supply: _typed, ...board } = boardSizingInput(settings, ways);
  return sizeSite({
    siteId: 'warm-up',
    origin: settings.supply,
    boards: [{ id: 'warm-up', name: settings.name, siteId: 'warm-up', feed: { from: 'origin' }, board }],
  });
}
