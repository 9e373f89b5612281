/** The runtime with its spread (issue 20 point 3): the entry of the folder (re-exports only). */
export { costRanking, runSpread, spreadPlan, spreadRun, spreadSensitivity, spreadSummary, SPREAD_METHOD, SENSITIVITY_METHOD, COST_SENSITIVITY_METHOD, type SampleFigures, type SpreadChunk, type SpreadOptions, type SpreadPlan, type SpreadResult, type Swing, type Outcome } from './run.ts';
export { DEFAULT_SPREAD_SAMPLES, DEFAULT_SPREAD_SEED, INPUT_WORDS, SPREAD_INPUTS, TOLERANCE_FIELD, TYPICAL_TOLERANCES, TYPICAL_WHY, ZERO_TOLERANCES, tolerancesOf, type SpreadInput, type Tolerances } from './tolerances.ts';
export { drawSamples, changeOf, shiftEfficiency, NOMINAL_DRAW, SCALED_LOAD_KINDS, type Draw } from './sample.ts';
export { histogram, percentiles, quantileSorted, type HistogramBin, type Percentiles } from './stats.ts';
export { formatSpread } from './text.ts';
