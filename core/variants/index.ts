/** The quick variants (see types.ts): re-exports only. */
export type { QuickVariantOutcome } from './types.ts';
export { SYSTEM_VOLTAGES, seriesForSystem, systemBank, systemVoltageVariant, MADE_FOR_VOLTAGE, type SystemVoltage, type SystemVoltageOptions } from './system-voltage.ts';
export { criticalLoadsVariant } from './critical-loads.ts';
export { nextSizeUpVariant } from './next-size.ts';
export { restrungResistance, type Stringing } from './bank-resistance.ts';
export { changedFields, mergeSet } from '../solve/project-variant.ts';
