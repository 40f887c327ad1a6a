/**
 * Adiabatic k factors for protective conductors, A·√s/mm².
 * Source: BS 7671:2018+A2:2022 Tables 54.2, 54.3 and 54.4 — every value here CONFIRMED
 * against a public reproduction of the 18th edition tables (an NICEIC pocket guide, 2018).
 * Table 54.3 (copper cpc as a core of a cable or bunched with cables): 70 °C thermoplastic
 * 115 (103 above 300 mm²), 90 °C thermosetting 143.
 * Table 54.2 (separate insulated copper cpc, not bunched): 70 °C thermoplastic 143.
 * Table 54.4 (steel armour as the cpc): 51 for a 70 °C thermoplastic cable, 46 for a 90 °C
 * thermosetting cable.
 */
export const K_VALUES = {
  coreThermoplastic70: 115,
  coreThermoplastic70Over300: 103,
  coreThermosetting90: 143,
  separateThermoplastic70: 143,
  steelArmourThermoplastic70: 51,
  steelArmourThermosetting90: 46,
} as const;
