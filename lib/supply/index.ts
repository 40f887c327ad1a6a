/**
 * A site's boards as one supply tree: the values carried down from the origin to every board
 * (earth fault loop impedance, prospective fault current, voltage drop used, the sub-mains'
 * design currents, selectivity), each with its working, and every board sized with them.
 * Pure (no database). A design aid: see SIZING_CAUTION in lib/sizing.
 */
export { sizeSite, sizingOutcome, subMainLoad, unsizedBoard, worstVerdictOf, type SizingOutcome } from './size-site';
export { boardMaxDemand } from './max-demand';
export { groupSelectivity, placesWords, type SelectivityGroup } from './group-selectivity';
export { validateTree, wayLabels, SiteTreeError, type SiteTreeIssue } from './validate-tree';
export {
  overcurrentSelectivity,
  rcdSelectivity,
  GG_FUSE_RATIO,
  INSTANTANEOUS_LOWER_MULTIPLE,
  RCD_RATIO,
  type OvercurrentDevice,
} from './selectivity';
export type * from './types';
