/**
 * The one shape of a board. Everything else is derived from these schemas: the DTO the API
 * answers, the save input (a plain subset of the DTO: its version, settings and the ways'
 * design fields), the Sequelize models' attribute types (`models/board.ts`, `models/way.ts`)
 * and the engine's input (`engineInputOf`). The supply is the engine's own schema, with the
 * limits it checks (Uo 100–277 V line-to-earth).
 */
import { z } from 'zod';

import { BOARD_STATUSES, LABEL_STATUSES } from '@/lib/domain';
import { circuitSpecSchema, deviceOnRailSchema, supplySchema, type BoardInput } from '@/lib/sizing';

import type { DerivedSupply } from '@/lib/sites/tree-types';

import type { WayCounts } from './counts';
import { layoutWays, railOrder } from './layout';

export const incomingDeviceSchema = z
  .object({
    kind: z.enum(['main-switch', 'mcb', 'fuse-bs88-2', 'rcd']),
    ratingA: z.number().int().min(1).max(1600),
    busbarRatingA: z.number().int().min(1).max(4000).optional(),
  })
  .strict();

/** The designer's design current for a sub-main, in place of the board's maximum demand, with why. */
export const designCurrentOverrideSchema = z
  .object({
    amps: z.number().gt(0, 'must be above 0 A').max(4000),
    reason: z.string().trim().min(1, 'Say why the design current is overridden.').max(300),
  })
  .strict();

/**
 * Where a board's supply comes from: the site's origin, or one way (a sub-main) of another board
 * of the same site. A board fed from a way is sized with the values carried down to it (its
 * typed supply is not used); see `sizeSite` (lib/supply/size-site.ts) for the method.
 */
export const boardFeedSchema = z.discriminatedUnion('from', [
  z.object({ from: z.literal('origin') }).strict(),
  z
    .object({
      from: z.literal('way'),
      boardId: z.uuid(),
      wayId: z.uuid(),
      /** The sub-main's design current typed by the designer, with a reason; null: the board's maximum demand. */
      designCurrentOverride: designCurrentOverrideSchema.nullable().default(null),
      /** Whether the RCD protecting the sub-main on the board above is time-delayed (type S). */
      upstreamRcdTimeDelayed: z.boolean().default(false),
    })
    .strict(),
]);
export type BoardFeed = z.infer<typeof boardFeedSchema>;

/** The fields of a board other than its ways. */
export const boardSettingsSchema = z
  .object({
    name: z.string().trim().min(1, 'Give the board a name.').max(160),
    location: z.string().trim().max(200).default(''),
    phases: z.union([z.literal(1), z.literal(3)]),
    supply: supplySchema,
    incoming: incomingDeviceSchema,
    enclosureModules: z.number().int().min(4).max(400),
    rails: z.number().int().min(1).max(12).default(1),
    dwelling: z.boolean().default(false),
    /**
     * Rated conditional short-circuit current of the assembly, kA, where the maker declares
     * one (a consumer unit to BS EN 61439-3: 16 kA); null or absent when none is declared.
     */
    conditionalRatingKa: z.number().gt(0, 'must be above 0 kA').max(200).nullable().optional(),
    /** Where the board is fed from (absent in a save: unchanged). */
    feed: boardFeedSchema.optional(),
  })
  .strict();
export type BoardSettings = z.infer<typeof boardSettingsSchema>;

export const boardCreateSchema = boardSettingsSchema.extend({ siteId: z.uuid() }).strict();
export type BoardCreateInput = z.infer<typeof boardCreateSchema>;

export const boardRenameSchema = z
  .object({
    name: z.string().trim().min(1, 'Give the board a name.').max(160).optional(),
    location: z.string().trim().max(200).optional(),
  })
  .strict();

export const idParamsSchema = z.object({ boardId: z.uuid() });

/** One way as the editor sends it: its place on the rail, its device and its circuit. */
export const wayInputSchema = z
  .object({
    id: z.uuid(),
    rail: z.number().int().min(0).max(11),
    position: z.number().int().min(0).max(400),
    device: deviceOnRailSchema,
    circuit: circuitSpecSchema.nullable(),
  })
  .strict();
export type WayInput = z.infer<typeof wayInputSchema>;

/** A whole-board save: the version it was loaded at, its settings and every way. */
export const boardSaveSchema = z
  .object({
    version: z.number().int().min(1),
    settings: boardSettingsSchema,
    ways: z.array(wayInputSchema).max(400),
    /**
     * The save removes, moves or re-points a way that feeds other boards, or changes this
     * board's feed: without this, such a save answers 409 naming the boards that change.
     */
    confirmFeedChanges: z.boolean().optional(),
  })
  .strict()
  .superRefine((value, ctx) => {
    const seen = new Set<string>();
    const places = new Set<string>();
    value.ways.forEach((way, i) => {
      if (seen.has(way.id)) {
        ctx.addIssue({ code: 'custom', path: ['ways', i, 'id'], message: 'This way id appears twice.' });
      }
      seen.add(way.id);
      const place = `${way.rail}:${way.position}`;
      if (places.has(place)) {
        ctx.addIssue({
          code: 'custom',
          path: ['ways', i, 'position'],
          message: 'Two ways cannot share one place on the rail.',
        });
      }
      places.add(place);
    });
  });
export type BoardSaveInput = z.infer<typeof boardSaveSchema>;

/** A way as the API hands it to the client: its design and its label check on site. */
export const wayDtoSchema = wayInputSchema.extend({ labelStatus: z.enum(LABEL_STATUSES), labelNote: z.string() });
export type WayDto = z.infer<typeof wayDtoSchema>;

/** A board as the API hands it to the client: plain data, never a model instance. */
export const boardDtoSchema = boardSettingsSchema.extend({
  id: z.uuid(),
  siteId: z.uuid(),
  siteName: z.string(),
  status: z.enum(BOARD_STATUSES),
  version: z.number().int(),
  revision: z.number().int(),
  updatedAt: z.string(),
  ways: z.array(wayDtoSchema),
  feed: boardFeedSchema,
  /**
   * The supply the board is sized with when it is not its typed `supply`: the site's origin, or
   * the values carried down a sub-main (then `supply` is not used and is read-only). Null: the
   * typed supply is used (a site whose origin is not given yet, and the board fed from it).
   */
  derivedSupply: z.custom<DerivedSupply>().nullable(),
});
export type BoardDto = z.infer<typeof boardDtoSchema>;

/** The columns of a boards row (the model's attributes): the settings and the record's fields. */
export type BoardRow = Omit<BoardSettings, 'feed'> &
  Pick<BoardDto, 'id' | 'siteId' | 'status' | 'version' | 'revision'> & {
    organisationId: string;
    conditionalRatingKa: number | null;
    createdById: string | null;
    archivedAt: Date | null;
    archivedById: string | null;
    deletedAt: Date | null;
    deletedById: string | null;
    designChangedById: string | null;
    createdAt: Date;
    updatedAt: Date;
  };

/** The columns of a ways row (the model's attributes). */
export type WayRow = Omit<WayDto, 'device' | 'circuit'> & {
  device: WayInput['device'];
  circuit: WayInput['circuit'];
  boardId: string;
  labelCheckedById: string | null;
  labelCheckedAt: Date | null;
  createdAt: Date;
  updatedAt: Date;
};

/** A board in the lists. */
export type BoardSummary = Pick<
  BoardDto,
  'id' | 'siteId' | 'siteName' | 'name' | 'location' | 'phases' | 'status' | 'revision' | 'updatedAt'
> & {
  /** Ways by way number (counts.ts), the same as `counts.ways`. */
  wayCount: number;
  counts: WayCounts;
  /** When the board (or its site) was archived; null for a live board. */
  archivedAt: string | null;
  /** Whether a revision of it was ever issued (then it is archived, never deleted). */
  everIssued: boolean;
};

/** The design fields of a way (what a save writes). */
export function wayInputOf(way: WayInput): WayInput {
  return { id: way.id, rail: way.rail, position: way.position, device: way.device, circuit: way.circuit };
}

/** The save input of a board as read: its version, settings and the ways' design fields. */
export function saveInputOf(board: BoardDto): BoardSaveInput {
  return { version: board.version, settings: settingsOf(board), ways: board.ways.map(wayInputOf) };
}

/**
 * The engine's board input from a board's settings and ways: ways in rail order, and on
 * a three-phase board each single-pole device on the phase its position gives it.
 */
export function engineInputOf(settings: BoardSettings, ways: readonly WayInput[]): BoardInput {
  const ordered = railOrder(ways);
  const places = new Map(layoutWays(settings.phases, ordered).map((p) => [p.id, p]));
  return {
    supply: settings.supply,
    phases: settings.phases,
    enclosureModules: settings.enclosureModules,
    incoming: settings.incoming,
    dwelling: settings.dwelling,
    conditionalRatingKa: settings.conditionalRatingKa ?? null,
    ways: ordered.map((way) => {
      const phase = places.get(way.id)?.phases;
      const onePhase = settings.phases === 3 && way.device.poles < 3 && phase?.length === 1;
      return { id: way.id, device: onePhase ? { ...way.device, phase: phase[0] } : way.device, circuit: way.circuit };
    }),
  };
}

/** Just the settings of a board row or DTO (for snapshots, sizing and saves). */
export function settingsOf(board: BoardSettings): BoardSettings {
  return {
    name: board.name,
    location: board.location,
    phases: board.phases,
    supply: board.supply,
    incoming: board.incoming,
    enclosureModules: board.enclosureModules,
    rails: board.rails,
    dwelling: board.dwelling,
    conditionalRatingKa: board.conditionalRatingKa ?? null,
  };
}
