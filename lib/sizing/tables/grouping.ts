/**
 * Grouping correction factor Cg for several circuits or multicore cables.
 * Source: BS 7671:2018+A2:2022 Table 4C1 (IEC 60364-5-52 Table B.52.17). Confirmed.
 * Bunched: in air, on a surface, embedded or enclosed — 1–9, 12, 16, 20 circuits; the last
 * column applies to 20 or more (from memory: the IEC column heading reads "≥ 20").
 * Single layer on a wall or floor, touching: 1–9 circuits, no further reduction beyond 9.
 * Beyond a tabulated count use the next higher count.
 */
export const GROUPING_CG = {
  bunched: [
    [1, 1.0],
    [2, 0.8],
    [3, 0.7],
    [4, 0.65],
    [5, 0.6],
    [6, 0.57],
    [7, 0.54],
    [8, 0.52],
    [9, 0.5],
    [12, 0.45],
    [16, 0.41],
    [20, 0.38],
  ],
  'single-layer': [
    [1, 1.0],
    [2, 0.85],
    [3, 0.79],
    [4, 0.75],
    [5, 0.73],
    [6, 0.72],
    [7, 0.72],
    [8, 0.71],
    [9, 0.7],
  ],
} as const;

/**
 * Grouping factors for multicore cables in the ground (method D), by number of circuits
 * (2–6) and the clearance between cables or ducts, m. Beyond 6 circuits the tables give no
 * factor (the engine then fails the capacity check and asks for a load study).
 *
 * Table 4C2, cables direct in the ground, columns: touching, one cable diameter (taken as
 * 0.05 m, a conservative stand-in for a small armoured cable), 0.125 m, 0.25 m, 0.5 m.
 * Table 4C3, multicore cables in single-way ducts in the ground, columns: touching,
 * 0.25 m, 0.5 m, 1.0 m.
 * Source: BS 7671:2018+A2:2022 Tables 4C2 and 4C3 (IEC 60364-5-52 Tables B.52.18/B.52.19).
 * 4C2 0.5 m column for 4 or more circuits (0.80) and the table ending at 6 circuits:
 * CONFIRMED in public discussion of the 18th edition table (IET forum). Every other cell:
 * FROM MEMORY — verify against a printed copy. Between spacings the column at or below the
 * actual clearance is used (conservative).
 */
export const GROUND_GROUPING_CG = {
  direct: {
    spacingsM: [0, 0.05, 0.125, 0.25, 0.5],
    rows: [
      [2, [0.75, 0.8, 0.85, 0.9, 0.9]],
      [3, [0.65, 0.7, 0.75, 0.8, 0.85]],
      [4, [0.6, 0.6, 0.7, 0.75, 0.8]],
      [5, [0.55, 0.55, 0.65, 0.7, 0.8]],
      [6, [0.5, 0.55, 0.6, 0.7, 0.8]],
    ],
  },
  ducts: {
    spacingsM: [0, 0.25, 0.5, 1.0],
    rows: [
      [2, [0.85, 0.9, 0.95, 0.95]],
      [3, [0.75, 0.85, 0.9, 0.95]],
      [4, [0.7, 0.8, 0.85, 0.9]],
      [5, [0.65, 0.8, 0.85, 0.9]],
      [6, [0.6, 0.8, 0.8, 0.9]],
    ],
  },
} as const;
