/**
 * The cost over the years, part 3: a standby generator's fuel (core/studies/lifetime.ts holds the entry).
 * Method: the fuel curve interpolated linearly between the maker's points at ¼, ½ and full load
 * (piecewise-linear interpolation); below ¼ the ¼–½ line extended towards no load (never below 0);
 * above full load refused. Fuel a year = Σ rate × hours over the runs.
 */
import type { Problem } from '../model/errors.ts';
import { PROJECT_LEVEL } from '../model/errors.ts';
import type { GeneratorFuel } from '../model/project.ts';
import { sigText } from '../model/message.ts';
import { DIESEL_FUEL_CHART, LITRES_PER_US_GALLON } from '../data/diesel-fuel-typical.ts';

const bad = (field: string, value: unknown, message: string): Problem => ({ code: 'invalid-value', elementId: PROJECT_LEVEL, field, value, message });

/** The fuel curve as three points of (load fraction, L/h). */
function fuelPoints(g: Pick<GeneratorFuel, 'quarterLoadLitresPerHour' | 'halfLoadLitresPerHour' | 'fullLoadLitresPerHour'>): [number, number][] {
  return [
    [0.25, g.quarterLoadLitresPerHour],
    [0.5, g.halfLoadLitresPerHour],
    [1, g.fullLoadLitresPerHour],
  ];
}

/**
 * Fuel rate at a load fraction (L/h): piecewise-linear interpolation between the ¼, ½ and full-load
 * points; below ¼ the ¼–½ line extended towards no load (never below 0). Null above full load
 * (the generator would be overloaded; the maker's table ends there).
 */
export function fuelRate(g: Pick<GeneratorFuel, 'quarterLoadLitresPerHour' | 'halfLoadLitresPerHour' | 'fullLoadLitresPerHour'>, loadFraction: number): number | null {
  if (!(loadFraction >= 0) || loadFraction > 1 + 1e-9) return null;
  const p = fuelPoints(g);
  const seg = loadFraction <= 0.5 ? [p[0]!, p[1]!] : [p[1]!, p[2]!];
  const [[x0, y0], [x1, y1]] = seg as [[number, number], [number, number]];
  return Math.max(0, y0 + ((y1 - y0) * (loadFraction - x0)) / (x1 - x0));
}

/** One stretch of the generator's year: its output power, hours a year, and the fuel it burns. */
export interface FuelRun {
  what: 'outages' | 'recharges';
  powerW: number;
  hoursPerYear: number;
  loadFraction: number;
  litresPerHour: number;
  litresPerYear: number;
}

export interface GeneratorYear {
  ratedPowerW: number;
  /** Where the rated power came from: the settings, or the generator's VA rating × 0.8. */
  ratedPowerFrom: 'settings' | 'generator rating';
  runs: FuelRun[];
  litresPerYear: number;
  /** Fuel cost a year, when a fuel price is given. */
  fuelCostPerYear?: number;
}

/** The recharge after one outage, as the battery backup study gives it (core/studies/backup/recharge.ts). */
export interface RechargeRun {
  /** AC energy the charger draws over one recharge, Wh. */
  energyWh: number;
  /** Time of one recharge, s. */
  timeSeconds: number;
}

/** The generator's fuel over a year (fuel curve interpolated per run, rate × hours summed). */
export function generatorFuelPerYear(
  g: GeneratorFuel,
  ratedPowerW: number,
  runs: readonly { what: FuelRun['what']; powerW: number; hoursPerYear: number }[],
): { ok: true; fuel: Omit<GeneratorYear, 'ratedPowerFrom'> } | { ok: false; problems: Problem[] } {
  const out: FuelRun[] = [];
  for (const r of runs) {
    const loadFraction = Math.max(0, r.powerW) / ratedPowerW;
    const rate = fuelRate(g, loadFraction);
    if (rate === null) {
      return {
        ok: false,
        problems: [bad('running.generator.ratedPower', ratedPowerW, `is below the ${sigText(r.powerW / 1000, 3)} kW the generator carries through the ${r.what} (${sigText(loadFraction * 100, 3)} % of its rating): the fuel table ends at full load`)],
      };
    }
    out.push({ ...r, loadFraction, litresPerHour: rate, litresPerYear: rate * r.hoursPerYear });
  }
  const litresPerYear = out.reduce((s, r) => s + r.litresPerYear, 0);
  return { ok: true, fuel: { ratedPowerW, runs: out, litresPerYear, ...(g.fuelPricePerLitre !== undefined ? { fuelCostPerYear: litresPerYear * g.fuelPricePerLitre } : {}) } };
}

/** What the page offers beside the fuel figures: typical values, never the maker's own. */
export const TYPICAL_FUEL_NOTE = "typical value: use the maker's figure";

/**
 * Typical fuel figures of a diesel set of a rated power (W), L/h at ¼, ½ and full load: the
 * suppliers' chart (core/data/diesel-fuel-typical.ts) interpolated linearly in rated power between
 * its rows. Null outside the chart (20 kW to 2 MW): there is no typical figure to offer.
 */
export function typicalFuelFigures(ratedPowerW: number): { quarterLoadLitresPerHour: number; halfLoadLitresPerHour: number; fullLoadLitresPerHour: number; note: string } | null {
  const kw = ratedPowerW / 1000;
  const rows = DIESEL_FUEL_CHART;
  if (!(kw >= rows[0]!.kw) || kw > rows[rows.length - 1]!.kw) return null;
  const i = Math.max(0, rows.findIndex((r) => r.kw >= kw) - 1);
  const lo = rows[i]!;
  const hi = rows[Math.min(i + 1, rows.length - 1)]!;
  const t = hi.kw === lo.kw ? 0 : (kw - lo.kw) / (hi.kw - lo.kw);
  // Linear interpolation in rated power, then US gal → L.
  const at = (col: 0 | 1 | 3) => (lo.gph[col] + t * (hi.gph[col] - lo.gph[col])) * LITRES_PER_US_GALLON;
  return { quarterLoadLitresPerHour: at(0), halfLoadLitresPerHour: at(1), fullLoadLitresPerHour: at(3), note: TYPICAL_FUEL_NOTE };
}
