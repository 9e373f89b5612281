/**
 * The file format, part: the project's `spread` settings, the runtime with its spread
 * (core/studies/spread/). Every field is optional; a missing tolerance takes its typical value
 * (core/studies/spread/tolerances.ts), and a tolerance of 0 holds that input at the project's value.
 */
export interface SpreadSettings {
  /** Number of Monte Carlo samples (default 1000). */
  samples?: number;
  /** Seed of the generator: the same seed and samples give the same figures (default 1). */
  seed?: number;
  /** Bank capacity tolerance, ± % of the rated capacity. */
  capacityPercent?: number;
  /** Aging: the state of health lower by up to this many % of rated capacity. */
  agingPercent?: number;
  /** Cell temperature range, ± °C around the study's cell temperature. */
  temperatureC?: number;
  /** Converters' efficiency, ± percentage points on their curves. */
  efficiencyPoints?: number;
  /** Load levels, ± % on every load's level. */
  loadPercent?: number;
  /** End (cut-off) voltage, ± V per cell. */
  endVoltagePerCell?: number;
}

/** Most samples one spread runs (each is a solve and a runtime study). */
export const MAX_SPREAD_SAMPLES = 20_000;
