/**
 * The file's `optionSearch`: the settings of the search for the option that meets a target
 * (core/studies/search/): the target (runtime, drops within their limits, every motor start
 * "starts", an optional limit on the losses) and the candidates the user lists, per axis — strings
 * in the bank, conductor sizes per cable, whole alternative inverters. Every combination of one
 * choice per axis is a named variant of the chain (core/model/variants.ts), solved by
 * core/solve/project-variant.ts. SI units (W, h as the file's other study settings give hours).
 */
import type { Element } from './project.ts';

/** Most combinations one search tries (the rest are left out, with a message). */
export const SEARCH_MAX_COMBINATIONS = 2000;
/** Longest list of choices on one axis. */
export const SEARCH_MAX_CHOICES = 40;

/** Strings in parallel to try in one bank. */
export interface StringsCandidates {
  /** Id of the battery bank. */
  bank: string;
  /** Strings in parallel to try (whole numbers, 1 up). */
  counts: number[];
  /** Price of one string, currency units (absent: the bank's own price ÷ its strings, scaled). */
  pricePerString?: number;
}

/** Conductor sizes to try on one cable (its conductor's table: NEC or IEC, its material). */
export interface CableCandidates {
  /** Id of the cable (it must have a conductor spec). */
  cable: string;
  /** The sizes to try, as the table labels them ("10 mm²", "4 AWG"). */
  sizes?: string[];
  /** Or every listed size from this one … */
  fromSize?: string;
  /** … up to this one (both included). */
  toSize?: string;
  /** Price of the run at each size, currency units (a size without one counts as unpriced). */
  prices?: { size: string; price: number }[];
}

/** Whole alternative elements to put in place of one element (another inverter). */
export interface SwapCandidates {
  /** Id of the element to replace. */
  element: string;
  /** The alternatives (each keeps the replaced element's id and feed; its own price). */
  alternatives: Element[];
  /** Keep the element as it is among the choices (default true). */
  keepCurrent?: boolean;
}

export interface OptionSearch {
  /** Runtime the bank must reach, h (default: the battery backup study's target runtime). */
  targetRuntimeHours?: number;
  /** Highest total losses of the chain, W (optional). */
  maxLossW?: number;
  /** Order of the list: cheapest first (default) or lowest losses first. */
  order?: 'cost' | 'losses';
  strings?: StringsCandidates;
  cables?: CableCandidates[];
  inverters?: SwapCandidates[];
  /**
   * System voltages to try, V (each 12, 24 or 48; the first axis, core/studies/search/axes.ts): the DC
   * system's bank re-strung and the voltages that follow it changed (core/variants/system-voltage.ts);
   * the other candidates are then tried at each voltage (the strings count at that voltage).
   */
  systemVoltages?: number[];
}
