/** Conductor sizing: re-exports only (contract in README.md here). */
export { defaultCatalogue, findSize, type ConductorCatalogue, type NecTables, type IecTables, type SizeEntry, type Material } from './catalogue.ts';
export { prepareConductor, type Candidate, type PreparedConductor } from './prepare.ts';
export { CAUTION as CONDUCTOR_CAUTION, chooseDevice, choose, evaluate, resistanceAt, temperatureAt, methodDrop } from './size.ts';
export { approximateDrop, conductorResult } from './link-result.ts';
export { designCurrent, type DesignCurrent } from './design-current.ts';
export { pathDrops, resolveLimits, linkLimit, dropLimitsSchema, type ResolvedLimits } from './path-drop.ts';
