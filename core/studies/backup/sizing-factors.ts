/**
 * Bank sizing, part 2 of 7: the capacity factors — linear table interpolation, the IEEE 485 Table 1
 * temperature factor and its extrapolation below the table, Peukert's K_t and a datasheet K_t table.
 */
import { MAX_TEMPERATURE_EXTRAPOLATION_C } from '../../physics/bank.ts';
import type { CapacityTemperaturePoint, Chemistry } from '../../data/battery-chemistries.ts';
import { IEEE_485_TEMPERATURE_FACTORS } from '../../data/ieee-485.ts';
import type { CapacityFactorPoint } from './sizing-types.ts';

const LEAD_ACID: ReadonlySet<Chemistry> = new Set<Chemistry>(['flooded-lead-acid', 'vrla-agm', 'gel']);

export const isLeadAcid = (c: Chemistry): boolean => LEAD_ACID.has(c);

/** Linear interpolation in a table of rising x; null outside [x_0, x_last]. */
export function interpolate(xs: readonly number[], ys: readonly number[], x: number): number | null {
  const n = xs.length;
  if (n === 0 || x < xs[0]! || x > xs[n - 1]!) return null;
  if (n === 1) return ys[0]!;
  let i = 1;
  while (i < n - 1 && xs[i]! < x) i++;
  const x0 = xs[i - 1]!;
  const x1 = xs[i]!;
  const y0 = ys[i - 1]!;
  const y1 = ys[i]!;
  return x1 === x0 ? y1 : y0 + ((y1 - y0) * (x - x0)) / (x1 - x0);
}

/** Capacity factor at a temperature from the chemistry's table (linear interpolation), null outside. */
export function capacityFactorAt(table: readonly CapacityTemperaturePoint[], temperature: number): number | null {
  return interpolate(
    table.map((p) => p.temperatureC),
    table.map((p) => p.capacityFactor),
    temperature,
  );
}

/**
 * IEEE 485 Table 1 cell-size temperature correction factor at an electrolyte temperature (°C):
 * linear interpolation on the standard's own °C column; null outside −3.9…51.7 °C (see
 * `leadAcidTemperatureFactor` for the sizing's conservative extrapolation below the table).
 */
export function ieee485TemperatureFactor(temperature: number): number | null {
  return interpolate(
    IEEE_485_TEMPERATURE_FACTORS.map((r) => r.celsius),
    IEEE_485_TEMPERATURE_FACTORS.map((r) => r.factor),
    temperature,
  );
}

/**
 * The sizing's lead-acid temperature factor: IEEE 485 Table 1 inside it; below −3.9 °C the capacity
 * (1 ÷ factor) extrapolated linearly from the two coldest rows (−3.9 °C 1.52, −1.1 °C 1.43), as the
 * runtime study extrapolates the same rows of the chemistry's capacity table (bank.ts), so the two
 * agree; never below the coldest factor, up to MAX_TEMPERATURE_EXTRAPOLATION_C below the table; above 51.7 °C 1.00 without
 * credit (the table's note), refused with credit (extrapolating would flatter the capacity).
 * Null when refused.
 */
export function leadAcidTemperatureFactor(temperature: number, credit: boolean): { raw: number; extrapolated: boolean } | null {
  const inside = ieee485TemperatureFactor(temperature);
  if (inside !== null) return { raw: inside, extrapolated: false };
  const rows = IEEE_485_TEMPERATURE_FACTORS;
  const first = rows[0]!;
  const second = rows[1]!;
  if (temperature < first.celsius) {
    if (first.celsius - temperature > MAX_TEMPERATURE_EXTRAPOLATION_C) return null;
    const slope = (1 / second.factor - 1 / first.factor) / (second.celsius - first.celsius);
    const capacity = 1 / first.factor + slope * (temperature - first.celsius);
    if (!(capacity > 0)) return null;
    return { raw: Math.max(first.factor, 1 / capacity), extrapolated: true };
  }
  return credit ? null : { raw: 1, extrapolated: true };
}

/**
 * Capacity rating factor from Peukert's law (rated-capacity form t = H·(C/(I·H))^k):
 * K_t = C/I = H·(t/H)^(1/k), in hours; t and H in hours.
 */
export function peukertCapacityFactor(tHours: number, ratedHours: number, k: number): number {
  return ratedHours * Math.pow(tHours / ratedHours, 1 / k);
}

/** K_t from a datasheet table (times in s, K in h): log–log interpolation; null outside the table. */
export function tableCapacityFactor(table: readonly CapacityFactorPoint[], timeS: number): number | null {
  const v = interpolate(
    table.map((p) => Math.log(p.time)),
    table.map((p) => Math.log(p.factor)),
    Math.log(timeS),
  );
  return v === null ? null : Math.exp(v);
}
