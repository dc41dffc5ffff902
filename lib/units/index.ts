export { parseEng, formatEng, EngParseError } from './eng';
export type { UnitSymbol } from './eng';
