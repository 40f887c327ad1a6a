/**
 * Maximum disconnection times, s, for final circuits, by nominal voltage to earth Uo.
 * Source: BS 7671:2018+A2:2022 Table 41.1 (411.3.2.2). The 120 V < Uo ≤ 230 V row
 * (TN 0.4 s, TT 0.2 s) is confirmed; the other rows are from memory.
 * Distribution circuits, and final circuits above the limits of 411.3.2.2 (sockets over
 * 63 A, fixed equipment over 32 A): TN 5 s, TT 1 s (411.3.2.3/411.3.2.4, confirmed).
 */
export const FINAL_CIRCUIT_TIMES_S = [
  { maxUoV: 120, tn: 0.8, tt: 0.3 },
  { maxUoV: 230, tn: 0.4, tt: 0.2 },
  { maxUoV: 400, tn: 0.2, tt: 0.07 },
  { maxUoV: Infinity, tn: 0.1, tt: 0.04 },
] as const;

export const DISTRIBUTION_TIMES_S = { tn: 5, tt: 1 } as const;

/** Largest final circuit ratings that need the Table 41.1 time (411.3.2.2). */
export const FINAL_CIRCUIT_LIMITS_A = { sockets: 63, other: 32 } as const;

/**
 * Voltage drop limits, % of the nominal voltage, from the origin to the current-using
 * equipment. Source: BS 7671:2018+A2:2022 Appendix 4 Table 4Ab — public supply 3 %
 * lighting / 5 % other (confirmed); private supply 6 % / 8 % (confirmed on the IEC basis).
 */
export const VOLTAGE_DROP_LIMITS_PCT = {
  public: { lighting: 3, other: 5 },
  private: { lighting: 6, other: 8 },
} as const;

/** Floor-area limits of UK socket-outlet arrangements, m² (common practice, on-site guidance). */
export const SOCKET_ARRANGEMENTS = {
  'ring-32': { nominalA: 32, maxFloorAreaM2: 100, ring: true },
  'radial-32': { nominalA: 32, maxFloorAreaM2: 75, ring: false },
  'radial-20': { nominalA: 20, maxFloorAreaM2: 50, ring: false },
} as const;
