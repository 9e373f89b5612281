/**
 * The file format, part 7: the project-level study settings — pump duty, voltage-drop limits, the
 * battery backup study and its load profile.
 */

/**
 * The pump or fan element to study and its duty: flow (m³/s) and hours per year at that flow.
 * `pump` names a `pump` or a `fan` element by its id: the key kept its name from before fans
 * existed, so every file written before still opens unchanged (no format version step).
 */
export interface PumpDutyStudy {
  pump: string;
  duty: { flow: number; hours: number }[];
}

/**
 * Voltage-drop limits, % of the voltage where the path starts. `basis` picks a published set;
 * `perLinkPercent` / `totalPercent` override it.
 * - "nec-informational": 3 % per link, 5 % total (NEC 210.19(A) IN No. 3, 215.2(A) IN No. 2;
 *   informational notes, not enforceable on their own).
 * - "iec-a-lighting" 3 %, "iec-a-other" 5 %, "iec-b-lighting" 6 %, "iec-b-other" 8 % total
 *   (IEC 60364-5-52:2009 Annex G, Table G.52.1, informative; A = supplied from a public LV network,
 *   B = from a private supply).
 */
export interface DropLimits {
  basis?: 'nec-informational' | 'iec-a-lighting' | 'iec-a-other' | 'iec-b-lighting' | 'iec-b-other';
  perLinkPercent?: number;
  totalPercent?: number;
}

/**
 * How one load is set during a profile segment: a number is its power (W; VA for an
 * apparent-power load; A for a load given by its current, `dc-current-load` and `ac-current-load`,
 * which stays a constant-current load), `true` its value as given in the element, `false` off,
 * `{ percent }` a share of the element's own rated value (its power, apparent power or current),
 * 0…100: the element's value is the load's full draw, which the conductor sizing and the
 * converters' loading read from the element, so a level above it belongs in the element itself.
 */
export type LoadSetting = number | boolean | LoadPercent;

/** A load's level as a share of its element's rated value, % (0…100). */
export interface LoadPercent {
  percent: number;
}

/** One segment of a profile; loads not listed run at their element's power. */
export interface ProfileSegment {
  /** Length of the segment, h. */
  durationHours: number;
  loads?: Record<string, LoadSetting>;
}

/** One segment of a repeating 24-hour profile: lasts from `startHour` to the next segment's start. */
export interface DailySegment {
  /** Hour of the day at which this segment starts, 0 ≤ startHour < 24. */
  startHour: number;
  loads?: Record<string, LoadSetting>;
}

/** A load that switches on and off on its own (compressor, pump): on for `onMinutes` of every `periodMinutes`. */
export interface DutySchedule {
  /** Id of the load element. */
  load: string;
  periodMinutes: number;
  onMinutes: number;
  /** Minutes into the outage at which the first on-period starts (default 0). */
  offsetMinutes?: number;
}

/**
 * The load over time during the outage.
 * - `constant`: every load at its element's power.
 * - `segments`: the segments in turn, once (or over and over with `repeat`).
 * - `daily`: a 24-hour profile repeating, the outage starting at `startHour` of the day.
 * `duty` schedules apply on top of any of them (a load is on only when both say so).
 */
export type LoadProfile =
  | { kind: 'constant'; duty?: DutySchedule[] }
  | { kind: 'segments'; segments: ProfileSegment[]; repeat?: boolean; duty?: DutySchedule[] }
  | { kind: 'daily'; segments: DailySegment[]; startHour?: number; duty?: DutySchedule[] };

/** Settings of the battery backup study. Times carry their unit in the field name. */
export interface BackupStudy {
  profile: LoadProfile;
  /** Integration time step, s (default 60). */
  timeStepSeconds?: number;
  /** Longest outage simulated, h (default 168 = one week). */
  horizonHours?: number;
  /** Cell temperature during the outage, °C (default 25). */
  temperatureC?: number;
  /** Capacity left after aging, fraction of rated (default 1: a new bank; 0.8 at end of life). */
  stateOfHealth?: number;
  /**
   * What the bank is for (default 'backup'). 'backup': lead-acid and NiCd discharge to the maker's
   * end-of-discharge voltage per cell with no depth-of-discharge limit, and are sized so (IEEE 485,
   * IEEE 1115 standby sizing). 'cycling': the usable depth of discharge also ends the discharge and
   * bounds the size. Lithium keeps its usable depth of discharge (the BMS window) in both.
   */
  design?: 'backup' | 'cycling';
  // Settings of the sizing and recharge (core/studies/backup/sizing.ts, recharge.ts):
  /** Runtime the bank must give through the profile, h. */
  targetRuntimeHours?: number;
  /** Design margin on the sizing, ≥ 1 (default 1.10). */
  designMargin?: number;
  /** Aging factor on the sizing, ≥ 1 (default per chemistry). */
  agingFactor?: number;
  /** Standard capacities to pick from, Ah (default: continuous). */
  standardCapacitiesAh?: number[];
  /** Charger DC output current, A. */
  chargerCurrent?: number;
  /** Charger efficiency (DC out / AC in), 0…1. */
  chargerEfficiency?: number;
  /** Time in which the bank must be recharged, h. */
  targetRechargeHours?: number;
}

/**
 * What running the chain costs: the energy price and the hours a year it runs at the solved
 * operating point (core/studies/economics.ts, the yearly cost of the losses and of the pump duty
 * methods). The currency is the user's own (the page shows their locale's symbol; the file holds a
 * plain number).
 */
export interface RunningCost {
  /** Price of energy, currency units per kWh (≥ 0). Without it no cost is worked out. */
  energyPricePerKWh?: number;
  /** Hours per year at the solved operating point, 0…8784 h (default 8760: all year). */
  hoursPerYear?: number;
  // The cost over the years (core/studies/lifetime.ts): tariff, service life, discount rate, CO₂, generator fuel.
  /**
   * Night price of energy, currency units per kWh (≥ 0): with it `energyPricePerKWh` is the day
   * price, paid from `dayStartHour` to `dayEndHour`, and the night price the rest of the day.
   */
  nightPricePerKWh?: number;
  /** Hour of the day at which the day price starts, 0 ≤ h < 24 (default 7). */
  dayStartHour?: number;
  /** Hour of the day at which the day price ends, 0 < h ≤ 24, after the start (default 23). */
  dayEndHour?: number;
  /**
   * With a night price and the backup study's load profile: split the energy between the two prices as
   * the profile's day uses it (core/model/tariff.ts `profileDayHours`), not evenly over the day.
   */
  dayHoursFromProfile?: boolean;
  /**
   * Work out the losses over the backup study's load profile: each load state of its day solved through
   * the chain and its losses counted for the time it lasts (core/studies/loss-over-profile.ts), not the
   * operating point as drawn held all the hours.
   */
  lossesFromProfile?: boolean;
  /** Years of service the lifetime cost counts, 1…100. Without it no lifetime cost is worked out. */
  years?: number;
  /** Discount rate per year, a fraction (0.05 = 5 %), 0…1 (default 0: money keeps its value). */
  discountRate?: number;
  /** CO₂ emitted per kWh taken from the grid, kg/kWh (≥ 0), the user's figure. */
  gridCo2KgPerKWh?: number;
  /** The generator that carries the outages and the recharges, and the fuel it burns. */
  generator?: GeneratorFuel;
}

/**
 * A standby generator's fuel figures (the maker's fuel table) and its year of running: it carries
 * the chain's load through the outages (when the chain's source is the supply or the generator
 * itself) and the charger through the recharges after them (core/studies/lifetime.ts).
 */
export interface GeneratorFuel {
  /** Fuel burnt at ¼ of the rated power, litres per hour (> 0). */
  quarterLoadLitresPerHour: number;
  /** Fuel burnt at ½ of the rated power, litres per hour (> 0). */
  halfLoadLitresPerHour: number;
  /** Fuel burnt at the rated power, litres per hour (> 0). */
  fullLoadLitresPerHour: number;
  /**
   * Rated real power, W (> 0). Default, when the chain's source is the generator: its rating in VA
   * × 0.8, the rated power factor of generating sets.
   */
  ratedPower?: number;
  /** Hours of outage a year the generator runs through, 0…8784 h. */
  outageHoursPerYear: number;
  /** Outages a year, each followed by a recharge of the bank (default 0: no recharge counted). */
  outagesPerYear?: number;
  /** Price of fuel, currency units per litre (≥ 0; optional): the fuel then counts in the yearly cost. */
  fuelPricePerLitre?: number;
}
