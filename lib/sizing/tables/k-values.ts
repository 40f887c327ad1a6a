/**
 * Adiabatic k factors for copper protective conductors, A·√s/mm².
 * Source: BS 7671:2018+A2:2022 Table 54.3 (cpc as a core of a cable or bunched with
 * cables): 70 °C thermoplastic 115 (103 above 300 mm²), 90 °C thermosetting 143 —
 * confirmed. Table 54.2 (separate insulated cpc, not bunched, initial 30 °C):
 * 70 °C thermoplastic 143 — from memory.
 */
export const K_VALUES = {
  coreThermoplastic70: 115,
  coreThermoplastic70Over300: 103,
  coreThermosetting90: 143,
  separateThermoplastic70: 143,
} as const;
