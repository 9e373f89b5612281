/**
 * Plausible ranges of the physical quantities in a project, in SI (°C for temperatures), one table
 * that every kind's schema reads (and through the engine's validation, the page's forms: setField
 * checks a typed value with these schemas, so the field shows the same message as the CLI).
 *
 * The ranges are generous on purpose: they never refuse a real installation (a supply of 1 MV, a
 * 100 km run, a 1 GW plant, −80 °C in a polar station), only values no power chain has, which
 * today overflow the doubles or stall the solve (a source of 1e300 V, a cable of 1e9 m, a drive at
 * 1e20 Hz, an ambient below absolute zero). The limits are common practice (no source), chosen an
 * order of magnitude or more beyond the largest equipment the owner knows of; the messages name the
 * range with its unit, so a unit slip (kV typed as V, mm as m) is caught at its field.
 *
 * A field keeps its sign rule and its message ("must be greater than 0 V", "must not be negative
 * W"); the range check adds "must not exceed 1 MV …" / "must be at least 100 mV …".
 */
import { z } from 'zod/mini';
import { formatSi } from '../physics/si-prefix.ts';
import { q, say, wordedParams, type MessageUnit, type Worded } from '../model/message.ts';

export interface PlausibleRange {
  /** Smallest plausible value (inclusive), SI; 0 when the field's sign rule is the only lower bound. */
  readonly min: number;
  /** Largest plausible value (inclusive), SI. */
  readonly max: number;
  /** The unit as written in messages. */
  readonly unit: string;
  /** The quantity in words, for "the plausible range of <what> is …". */
  readonly what: string;
  /** Written with an SI prefix (1 MV, 100 km) rather than as a plain number (−80 °C, 10000 Ah). */
  readonly prefix?: boolean;
  /** A flow of air (a fan's): its bounds are shown in the fan form's unit (message.ts `air`). */
  readonly air?: true;
}

/** Absolute zero, °C (ISO 80000-5: 0 K = −273.15 °C). */
export const ABSOLUTE_ZERO_C = -273.15;

/**
 * The table. Each row: the range and the words of its message. Common practice (no source) for the
 * bounds; each comment says what the bound leaves room for.
 */
export const RANGES = {
  /** Low-voltage DC from a single cell (0.5 V) up to a 1 MV transmission line. */
  voltage: { min: 0.1, max: 1e6, unit: 'V', what: 'a voltage', prefix: true },
  /** Drives down to a creep speed of 0.1 Hz; supplies at 16.7, 50, 60 and 400 Hz; high-speed spindle drives up to 3 kHz. */
  frequency: { min: 0.1, max: 3000, unit: 'Hz', what: 'a frequency', prefix: true },
  /** A load or a loss: 0 (off) up to 1 GW, a large power plant. */
  power: { min: 0, max: 1e9, unit: 'W', what: 'a power', prefix: true },
  /** A rating: 1 mW (a sensor supply) up to 1 GW. */
  ratedPower: { min: 1e-3, max: 1e9, unit: 'W', what: 'a rated power', prefix: true },
  /** Apparent power of a load or a rating: up to 1 GVA. */
  apparentPower: { min: 0, max: 1e9, unit: 'VA', what: 'an apparent power', prefix: true },
  /** A rated apparent power: 1 mVA up to 1 GVA. */
  ratedApparentPower: { min: 1e-3, max: 1e9, unit: 'VA', what: 'a rated apparent power', prefix: true },
  /** Short-circuit power at a supply point: transmission grids reach some 50 GVA; 1 TVA leaves room. */
  shortCircuitPower: { min: 1, max: 1e12, unit: 'VA', what: 'a short-circuit power', prefix: true },
  /** A current (load, rating, design current): up to 1 MA (busbars carry some 10 kA). */
  current: { min: 0, max: 1e6, unit: 'A', what: 'a current', prefix: true },
  /** An interrupting rating: breakers and fuses interrupt up to some 200 kA; 1 MA leaves room. */
  interruptingCurrent: { min: 0, max: 1e6, unit: 'A', what: 'an interrupting rating', prefix: true },
  /** A cable run: up to 100 km (a long rural feeder or a wind-farm export cable). */
  length: { min: 0, max: 1e5, unit: 'm', what: 'a cable length', prefix: true },
  /**
   * Resistance per km: a 0.05 mm² signal wire is some 350 Ω/km, a fine resistance wire some
   * 500 kΩ/km (a link may model one); 1 MΩ/km leaves room.
   */
  resistancePerKm: { min: 0, max: 1e6, unit: 'Ω/km', what: 'a resistance per km', prefix: true },
  /** Reactance per km: 0.05–0.5 Ω/km on cables; as the resistance, 1 MΩ/km for a link given as a lumped impedance. */
  reactancePerKm: { min: 0, max: 1e6, unit: 'Ω/km', what: 'a reactance per km', prefix: true },
  /** A switch pole's contact resistance: some 0.05–1 mΩ on contactors and transfer switches; 1 Ω leaves room (a relay's coil typed in its place is refused). */
  contactResistance: { min: 0, max: 1, unit: 'Ω', what: 'a contact resistance', prefix: true },
  /** A source's own resistance or reactance: 0 (stiff) or at least 1 pΩ (see MIN_SOURCE_OHMS), up to 1 MΩ. */
  sourceOhms: { min: 0, max: 1e6, unit: 'Ω', what: 'a source impedance', prefix: true },
  /** An ambient or cell temperature: −80 °C (polar stations) up to 150 °C (hot plant rooms; tables then decide). */
  temperature: { min: -80, max: 150, unit: '°C', what: 'a temperature' },
  /** Motor speed: up to 1 000 000 rpm (high-speed spindles run at some 100 000 rpm). */
  speed: { min: 0, max: 1e6, unit: 'rpm', what: 'a speed' },
  /** Pump flow: up to 1000 m³/s (the largest drainage pumps move some 60 m³/s). */
  flow: { min: 0, max: 1000, unit: 'm³/s', what: 'a flow' },
  /** Fan flow: the same bounds as a pump's, written in the fan form's unit (m³/h or cfm, not gpm). */
  airFlow: { min: 0, max: 1000, unit: 'm³/s', what: 'a flow', air: true },
  /** Pump head: up to 10 000 m (multistage boiler-feed pumps reach some 4000 m). */
  head: { min: 0, max: 1e4, unit: 'm', what: 'a head' },
  /** Fan pressure: up to 1 MPa (high-pressure blowers reach some 20 kPa; process compressors more). */
  pressure: { min: 0, max: 1e6, unit: 'Pa', what: 'a fan pressure', prefix: true },
  /** Fluid density: from a gas at 0.01 kg/m³ (fans at altitude) to 25 000 kg/m³ (mercury is 13 534). */
  density: { min: 0.01, max: 25_000, unit: 'kg/m³', what: 'a density' },
  /** Datasheet load fraction: up to 10 (1000 % of rated output). */
  loadFraction: { min: 0, max: 10, unit: '', what: 'a load fraction' },
  /** Linear loss term k1 (W per W): up to 100 (an efficiency of 1 % is the floor elsewhere). */
  lossK1: { min: 0, max: 100, unit: '', what: 'a linear loss term' },
  /** Resistive loss term k2 (per W): a 1 W converter losing half its output resistively has 0.5 per W. */
  lossK2: { min: 0, max: 10, unit: 'per W', what: 'a resistive loss term' },
  /**
   * Battery capacity of one string: the largest cells hold some 3000 Ah. The bound is 1e12 Ah
   * because the battery study probes the runtime with the bank made a million times larger
   * (withEndlessBank in core/studies/backup/study.ts) and validates that project too: 1e6 Ah × 1e6.
   */
  capacity: { min: 0.001, max: 1e12, unit: 'Ah', what: 'a capacity' },
  /** Cells or blocks in series per string, strings in parallel: up to 10 000. */
  cellCount: { min: 1, max: 10_000, unit: '', what: 'a number of cells or strings' },
  /** Cells per block: up to 1000 (a 12 V lead-acid block has 6). */
  cellsPerBlock: { min: 1, max: 1000, unit: '', what: 'a number of cells per block' },
  /**
   * A cell's voltage (per cell, as the presets): from 0.1 V (below any cell's end of discharge, some
   * 0.8–1.0 V for nickel cells) up to 100 V, room for a block typed as a cell.
   */
  cellVoltage: { min: 0.1, max: 100, unit: 'V', what: 'a cell voltage', prefix: true },
  /** Cell resistance × capacity: some 0.1–1 Ω·Ah in practice; 1000 Ω·Ah leaves room. */
  resistanceAh: { min: 0, max: 1000, unit: 'Ω·Ah', what: 'a resistance × capacity' },
  /** Capacity factor against temperature: 0.001 up to 10 (a bank at 0.1 % of its capacity is no bank). */
  capacityFactor: { min: 0.001, max: 10, unit: '', what: 'a capacity factor' },
  /** The hours a capacity is rated at (C/20 → 20 h): 0.01 h (a 100 C rating) up to 10 000 h. */
  hours: { min: 0.01, max: 1e4, unit: 'h', what: 'a rated discharge time' },
  /**
   * A charge or discharge rate: from 0.001 per hour (C/1000, below any trickle charge; a subnormal
   * rate made the recharge time infinite) up to 1000 per hour (supercapacitor-like cells reach some 100 C).
   */
  cRate: { min: 0.001, max: 1000, unit: 'per hour', what: 'a charge or discharge rate' },
  /** A short duration (surge, motor start): up to 1 hour. */
  seconds: { min: 0, max: 3600, unit: 's', what: 'a duration', prefix: false },
  /** Parallel cable sets, current-carrying conductors, grouped circuits: up to 1000. */
  conductorCount: { min: 1, max: 1000, unit: '', what: 'a number of conductors or circuits' },
  /**
   * A power factor: 0.001 up to 1. Below 0.001 the reactive power is over 1000 times the real power
   * (Q = P·tan(arccos pf)), which overflows at 1e-308 and is no real load (a capacitor bank is given
   * as a circuit load instead).
   */
  powerFactor: { min: 0.001, max: 1, unit: '', what: 'a power factor' },
  /** A transformer's short-circuit impedance: up to 100 % (practice: 2–20 %). */
  impedancePercent: { min: 0, max: 100, unit: '%', what: 'an impedance percent' },
  /** A tolerance of the runtime spread (capacity, aging, load levels): up to ± 50 % (makers quote some ± 3–10 %). */
  tolerancePercent: { min: 0, max: 50, unit: '%', what: 'a tolerance' },
  /** Converters' efficiency tolerance, ± percentage points: up to 20 (makers quote some ± 1–2). */
  efficiencyPoints: { min: 0, max: 20, unit: '', what: 'an efficiency tolerance in percentage points' },
  /** The cell temperature's range in the runtime spread, ± °C (a difference, so no °F offset): up to 40. */
  temperatureRange: { min: 0, max: 40, unit: '', what: 'a temperature range in °C' },
  /** The end voltage's tolerance, ± V per cell: up to 1 V (cells end some 0.05–0.2 V apart by maker). */
  cellVoltageTolerance: { min: 0, max: 1, unit: 'V', what: 'an end voltage tolerance per cell' },
  /** Samples of the runtime spread: 10 (a rough look) up to 20 000 (each is a solve and a runtime study). */
  spreadSamples: { min: 10, max: 20_000, unit: '', what: 'a number of samples' },
} as const satisfies Record<string, PlausibleRange>;

export type Quantity = keyof typeof RANGES;

/** A bound as written in a message: 1 MV, 100 km, 0.1 Hz, −80 °C (a true minus sign), 10000 Ah. */
export function boundText(value: number, range: PlausibleRange): string {
  // Prefixes for the large bounds only: "0.1 V to 1 MV" reads better than "100 mV to 1 MV".
  const text = range.prefix && Math.abs(value) >= 1000 ? formatSi(value, range.unit) : `${value}${range.unit ? ` ${range.unit}` : ''}`;
  return text.replace(/^-/, '−');
}

/** "100 mV to 1 MV", "0 to 100 km". */
export function rangeText(q: Quantity): string {
  const r: PlausibleRange = RANGES[q];
  const low = r.min === 0 ? `0${r.unit ? ` ${r.unit}` : ''}` : boundText(r.min, r);
  return `${low} to ${boundText(r.max, r)}`;
}

/** How a field treats values below its range's minimum. */
export type Floor = 'positive' | 'non-negative' | 'range';

/**
 * The message for a number outside a quantity's range (or its sign rule), or null when it is
 * inside. `floor`: "positive" keeps "must be greater than 0 …" for 0 and below, "non-negative"
 * keeps "must not be negative …", "range" words the lower bound from the table.
 */
export function rangeMessage(q: Quantity, v: number, floor: Floor, signUnit?: string): string | null {
  return rangeWorded(q, v, floor, signUnit)?.message ?? null;
}

/**
 * `rangeMessage` with its bounds kept as quantities (core/model/message.ts), so the page writes
 * them in the user's units: "must not exceed {0}: the plausible range of a flow is {1} to {2}".
 */
export function rangeWorded(quantity: Quantity, v: number, floor: Floor, signUnit?: string): Worded | null {
  const r: PlausibleRange = RANGES[quantity];
  const unit = (signUnit ?? r.unit).trim();
  if (floor === 'positive' && !(v > 0)) return { message: `must be greater than 0 ${unit}`.trim() };
  if (floor === 'non-negative' && !(v >= 0)) return { message: `must not be negative ${unit}`.trim() };
  // In range (nearly always): no message is built (the validation runs per keystroke and per solve).
  const belowZero = r.unit === '°C' && v < ABSOLUTE_ZERO_C;
  if (!belowZero && !(v < r.min) && !(v > r.max)) return null;
  const u = r.unit as MessageUnit;
  const air = r.air ? { air: true as const } : {};
  const low = { ...q(r.min, u), ...air };
  const high = { ...q(r.max, u), ...air };
  const plausible = say`the plausible range of ${r.what} is ${low} to ${high}`;
  if (belowZero) return say`is below absolute zero (−273.15 °C): ${plausible}`;
  if (v < r.min) return say`must be at least ${low}: ${plausible}`;
  if (v > r.max) return say`must not exceed ${high}: ${plausible} (check the value and its unit)`;
  return null;
}

/**
 * The quantity and sign rule of every range check made by `ranged` / `rangedCount` (keyed by the
 * check, which a schema keeps when `.check()` or `z.optional` derive another from it), so the
 * published JSON Schema (core/schema/json-schema.ts) can state the range the refinement enforces.
 */
export const RANGE_CHECKS = new WeakMap<object, { quantity: Quantity; floor: Floor }>();

function rangeCheck<T extends object>(check: T, quantity: Quantity, floor: Floor): T {
  RANGE_CHECKS.set(check, { quantity, floor });
  return check;
}

const num = () => z.number({ error: 'must be a number' });

/**
 * A number field of quantity `q`: its sign rule (with the message it always had) and the table's
 * plausible range, in one check so that a value gets one message. `signUnit` replaces the unit in
 * the sign message when the field words it its own way (e.g. "(a fraction of rated output, 0.1 = 10 %)").
 */
export const ranged = (q: Quantity, floor: Floor = 'positive', signUnit?: string) =>
  num().check(
    rangeCheck(
      z.superRefine((v: number, ctx) => {
        const w = rangeWorded(q, v, floor, signUnit);
        if (w !== null) ctx.addIssue({ code: 'custom', message: w.message, input: v, params: wordedParams(w) });
      }),
      q,
      floor,
    ),
  );

/** A whole-number count in the quantity's range, e.g. cells in series. */
export const rangedCount = (q: Quantity) =>
  num().check(
    z.int('must be a whole number'),
    rangeCheck(
      z.superRefine((v: number, ctx) => {
        const w = rangeWorded(q, v, 'range');
        if (w !== null) ctx.addIssue({ code: 'custom', message: w.message, input: v, params: wordedParams(w) });
      }),
      q,
      'range',
    ),
  );

/** The range check of a value outside a schema (cross-field results, e.g. a bank's voltage). */
export const outOfRange = (q: Quantity, v: number): string | null => rangeMessage(q, v, 'range');
