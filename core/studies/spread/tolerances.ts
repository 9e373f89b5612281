/**
 * The inputs of the runtime spread, their tolerances and typical values. A tolerance of 0 holds its
 * input at the project's value; a missing one takes its typical value below. Typical values are
 * from memory (marked per row); the page and the CLI say "typical value: use the maker's figure".
 */
import type { SpreadSettings } from '../../model/spread.ts';

/** The inputs varied, in the order each sample draws them (keep it: a seed's samples depend on it). */
export const SPREAD_INPUTS = ['capacity', 'aging', 'temperature', 'efficiency', 'load', 'endVoltage'] as const;
export type SpreadInput = (typeof SPREAD_INPUTS)[number];

/** The tolerance settings of each input (the `spread` field that holds it). */
export const TOLERANCE_FIELD: Readonly<Record<SpreadInput, keyof SpreadSettings>> = {
  capacity: 'capacityPercent',
  aging: 'agingPercent',
  temperature: 'temperatureC',
  efficiency: 'efficiencyPoints',
  load: 'loadPercent',
  endVoltage: 'endVoltagePerCell',
};

export type Tolerances = Record<SpreadInput, number>;

/** Typical tolerances (units as the settings: %, %, °C, percentage points, %, V per cell). */
export const TYPICAL_TOLERANCES: Readonly<Tolerances> = {
  // from memory: makers state the rated capacity of new cells within some ± 3–5 %.
  capacity: 5,
  // common practice (from memory): a bank is replaced at 80 % of its rated capacity (the usual
  // end-of-life criterion in battery maintenance practice); 20 % spans a bank anywhere from new to end of life.
  aging: 20,
  // from memory: a room or enclosure without climate control swings some ± 5 °C over a season's outages.
  temperature: 5,
  // from memory: converter datasheets' efficiency curves are typical figures, units spread some ± 1 point.
  efficiency: 1,
  // from memory: a planner's load estimate is good to some ± 10 %.
  load: 10,
  // from memory: makers' end voltages differ by some ± 0.05 V per cell for the same chemistry and rate.
  endVoltage: 0.05,
};

/** What each input is, in the user's words (the page's and the CLI's). */
export const INPUT_WORDS: Readonly<Record<SpreadInput, string>> = {
  capacity: 'Bank capacity',
  aging: 'Aging (state of health)',
  temperature: 'Cell temperature',
  efficiency: 'Converter efficiency',
  load: 'Load levels',
  endVoltage: 'End voltage',
};

/** Why the typical value, in the user's words (shown under each tolerance). */
export const TYPICAL_WHY: Readonly<Record<SpreadInput, string>> = {
  capacity: "± 5 % typical value: use the maker's figure (new cells are rated within a few per cent).",
  aging: "20 % typical value: a bank anywhere from new to the end of its life at 80 % of rated capacity; use the maker's figure.",
  temperature: "± 5 °C typical value: the room's swing over the outages; use your site's figure.",
  efficiency: "± 1 point typical value: use the maker's figure (datasheet curves are typical units).",
  load: '± 10 % typical value: how well the loads are known; use your own estimate.',
  endVoltage: "± 0.05 V per cell typical value: use the maker's figure for the end voltage at your discharge rate.",
};

export const DEFAULT_SPREAD_SAMPLES = 1000;
export const DEFAULT_SPREAD_SEED = 1;

/** The tolerances in force: the settings' own, the typical value for each one missing. */
export function tolerancesOf(settings: SpreadSettings | undefined): Tolerances {
  const out = { ...TYPICAL_TOLERANCES };
  for (const input of SPREAD_INPUTS) {
    const v = settings?.[TOLERANCE_FIELD[input]];
    if (v !== undefined) out[input] = v;
  }
  return out;
}

/** Every tolerance 0: the spread is the single runtime. */
export const ZERO_TOLERANCES: Readonly<Tolerances> = { capacity: 0, aging: 0, temperature: 0, efficiency: 0, load: 0, endVoltage: 0 };
