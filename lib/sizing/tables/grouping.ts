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
