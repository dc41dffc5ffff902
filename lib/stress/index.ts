export * from './types';
export { solveStress, solveWithNetwork, DEFAULT_INPUT_CLAMP_CURRENT } from './solve';
export type { SolveOptions, StressResultWithTrace } from './solve';
export { solveStressCached, clearStressCache, stressCacheStats } from './cache';
export {
  parseGuard,
  parseStressCase,
  parseStressConditions,
  parseStressRequest,
  guardSchema,
  stressCaseSchema,
  stressConditionsSchema,
  stressRequestSchema,
  StressInputError,
} from './schema';
export type { StressRequest } from './schema';
export {
  resistorTemperatureFactor,
  semiconductorTemperatureFactor,
  varistorTemperatureFactor,
  tvsPulseFactor,
  DEFAULT_CONDITIONS,
} from './ratings';
export {
  surgeOpenCircuitVoltage,
  SURGE_GENERATOR_IMPEDANCE,
  ESD_CAPACITANCE,
  ESD_RESISTANCE,
} from './waveforms';
export { parseEng, formatEng, EngParseError } from '../units';
export {
  mainsCase,
  dcSupplyCase,
  surgeCase,
  esdCase,
  SURGE_COUPLING,
  SURGE_LEVELS,
  ESD_CONTACT_LEVELS,
} from './cases';
export type { SurgeCoupling } from './cases';
