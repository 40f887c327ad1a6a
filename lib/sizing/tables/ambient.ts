/**
 * Ambient temperature correction factor Ca, for cables in air with overload protection.
 * Source: BS 7671:2018+A2:2022 Table 4B1 (same values as IEC 60364-5-52 Table B.52.14 at
 * 30 °C and above). The 25 °C row (1.03 / 1.02) is the BS 7671 value for cables with
 * overload protection. Rows 25–60 °C (70 °C cable) and 25–70 °C (90 °C cable) are
 * confirmed; 75 and 80 °C for 90 °C cable are from memory (they agree with the formula; the
 * public table found for 90 °C flexible cords, 4F2A, reads 0.50 and 0.40 — a different table).
 * Between rows use the next higher tabulated temperature; below 25 °C the 25 °C row is
 * used (conservative). Above the last row the cable may not be used: no factor.
 */
export const AMBIENT_CA = {
  70: [
    [25, 1.03],
    [30, 1.0],
    [35, 0.94],
    [40, 0.87],
    [45, 0.79],
    [50, 0.71],
    [55, 0.61],
    [60, 0.5],
  ],
  90: [
    [25, 1.02],
    [30, 1.0],
    [35, 0.96],
    [40, 0.91],
    [45, 0.87],
    [50, 0.82],
    [55, 0.76],
    [60, 0.71],
    [65, 0.65],
    [70, 0.58],
    [75, 0.5],
    [80, 0.41],
  ],
} as const;

/**
 * Ground temperature correction factor for cables buried in the ground (method D),
 * 90 °C thermosetting insulation, reference ground temperature 20 °C.
 * Source: BS 7671:2018+A2:2022 Table 4B2 (IEC 60364-5-52 Table B.52.15) — FROM MEMORY,
 * verify against a printed copy. Next higher tabulated temperature between rows.
 */
export const GROUND_CA_90 = [
  [10, 1.07],
  [15, 1.04],
  [20, 1.0],
  [25, 0.96],
  [30, 0.93],
  [35, 0.89],
  [40, 0.85],
  [45, 0.8],
  [50, 0.76],
  [55, 0.71],
  [60, 0.65],
  [65, 0.6],
  [70, 0.53],
  [75, 0.46],
  [80, 0.38],
] as const;
