import { z } from 'zod';
import { circuitSpecSchema, deviceOnRailSchema, UO_MESSAGE } from '@/lib/sizing';

/** The supply at the board's origin, as the designer records it. */
export const boardSupplySchema = z
  .object({
    earthing: z.enum(['TN-S', 'TN-C-S', 'TT']),
    // Line-to-earth (230 V on a 230/400 V supply); the engine refuses anything outside 100–277 V
    uoV: z.number().min(100, UO_MESSAGE).max(277, UO_MESSAGE),
    zeOhm: z.number().min(0).max(200),
    pfcKa: z.number().min(0).max(100),
    source: z.enum(['public', 'private']),
  })
  .strict();

export const incomingDeviceSchema = z
  .object({
    kind: z.enum(['main-switch', 'mcb', 'fuse-bs88-2', 'rcd']),
    ratingA: z.number().int().min(1).max(1600),
    busbarRatingA: z.number().int().min(1).max(4000).optional(),
  })
  .strict();

/** The fields of a board other than its ways. */
export const boardSettingsSchema = z
  .object({
    name: z.string().trim().min(1, 'Give the board a name.').max(160),
    location: z.string().trim().max(200).default(''),
    phases: z.union([z.literal(1), z.literal(3)]),
    supply: boardSupplySchema,
    incoming: incomingDeviceSchema,
    enclosureModules: z.number().int().min(4).max(400),
    rails: z.number().int().min(1).max(12).default(1),
    dwelling: z.boolean().default(false),
    /**
     * Rated conditional short-circuit current of the assembly, kA, where the maker declares
     * one (a consumer unit to BS EN 61439-3: 16 kA); null or absent when none is declared.
     */
    conditionalRatingKa: z.number().gt(0, 'must be above 0 kA').max(200).nullable().optional(),
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
