export * from './types';
export {
  mapExposures,
  buildWiringIndex,
  resolveWeights,
  describeHazard,
  mechanismOfRoute,
  ROUTE_LIKELIHOOD,
} from './map';
export { checkSegregation, voltageBand, SEGREGATION_CLAUSE, type VoltageBand } from './segregation';
export {
  checkWireColours,
  parseWireColour,
  colourRuleFor,
  type WireColour,
  type ColourRule,
} from './colour';
export {
  normaliseWireNumber,
  similarWireNumbers,
  rotatedReading,
  wireNumberLikeness,
} from './lookalike';
export {
  hazardCurrentKind,
  nominalPeakVoltage,
  isHazard,
  isTargetClass,
  terminalNumberOf,
} from './hazard';
export { buildStripLayout, barrierBetween, type StripLayout } from './strip-layout';
