/**
 * Boardwright sizing engine: pure BS 7671:2018+A2:2022 circuit and board sizing.
 * A design aid: results must be checked by a competent person against the current edition
 * of BS 7671 (or local wiring rules) and manufacturers' data; local codes and licensed
 * practice take precedence.
 */
export { sizeCircuit, BS7671, NEAR_LIMIT_SHARE } from './size-circuit';
export {
  parseBoardInput,
  parseCircuitInput,
  reviseBoardInput,
  SizingInputError,
  type SizingInputIssue,
} from './validate';
export { sizeBoard, applyDiversity, circuitForWay, diversityClass, isProtectiveDevice } from './board';
export type { BoardResult, BoardSummary, DiversityRule, Phase, WayResult } from './board';
export {
  boardInputSchema,
  circuitDeviceSchema,
  circuitInputSchema,
  circuitSchema,
  circuitSpecSchema,
  deviceOnRailSchema,
  supplySchema,
  UO_MESSAGE,
  waySchema,
  RAIL_DEVICE_KINDS,
} from './schemas';
export type {
  BoardInput,
  CircuitDeviceInput,
  CircuitFields,
  CircuitInput,
  CircuitSpec,
  DeviceOnRail,
  EngineWayInput,
  RailDeviceKind,
  SupplyInput,
} from './schemas';
export * from './types';
export { designCurrent, chooseRating, socketArrangementCurrent } from './design-current';
export {
  ambientFactor,
  conductorFactor,
  groundFactor,
  correctionFactors,
  effectiveTabulated,
  groundGroupingFactor,
  groupingFactor,
  insulationFactor,
  requiredCapacity,
  requiredTabulatedCurrent,
} from './factors';
export { lineVoltage, nominalVoltage, voltageDrop, voltageDropLimitPct } from './voltage-drop';
export { conductorResistance20, loopImpedance, r1r2PerMetre } from './loop-impedance';
export {
  additionalRcdReasons,
  breakerDisconnectionCurrent,
  breakerLetThrough,
  breakerTripCurrent,
  faultEnergy,
  fuseOperatingTime,
  kFactor,
  maxZs,
  minimumCpc,
  requiredDisconnectionTime,
} from './protection';
export { chooseCableSize } from './cable-selection';
export { cableRows, methodsFor, CABLE_PROPERTIES } from './tables/cables';
export { STANDARD_RATINGS_A, RCD_SENSITIVITIES_MA } from './tables/ratings';

/** The caution every sizing screen and printed schedule carries. */
export const SIZING_CAUTION =
  'A design aid: results must be checked by a competent person against the current edition of BS 7671 (or local wiring rules) and manufacturers’ data; local codes and licensed practice take precedence.';
export { ENGINE_REVISION } from './revision';
