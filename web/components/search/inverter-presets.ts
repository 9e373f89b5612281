/**
 * Inverters to try in place of one in the chain: the editor's inverter template (web/editor/templates.ts,
 * a constant-efficiency inverter) at three efficiencies, each with an idle draw (its no-load loss, drawn
 * whatever the output: core/physics/loss-model.ts adds `idleLoss` to the constant model), on the AC side
 * of the inverter it would replace (its phases, output voltage and frequency, its cut-off, its rating).
 * The efficiencies and the idle draw are typical values to start from; the page says to use the maker's
 * figure, and the user may give the idle draw of each. The inverter as it is (its own loss model: a
 * curve, its own idle draw) stays one of the choices (the search's `keepCurrent`, true by default).
 */
import type { DraftElement } from '../../state/editor.ts';

/** Typical efficiencies of small sine-wave inverters, 92–96 % (common practice (no source)). */
export const PRESET_EFFICIENCIES = [0.92, 0.94, 0.96] as const;

/**
 * Idle draw of a small sine-wave inverter as a share of its rating: about 1 % (common practice (no
 * source), from memory: makers list some 10–40 W for 1–5 kW units).
 */
export const PRESET_IDLE_SHARE = 0.01;

const num = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? v : undefined);

/** The rating of an inverter as the presets read it: its loss model's rated power, else its rated output. */
export function inverterRating(current: DraftElement): number | undefined {
  const loss = current['loss'] as Record<string, unknown> | undefined;
  return num(loss?.['ratedPower']) ?? num(current['ratedOutputPower']);
}

/**
 * The idle draw a preset takes for the inverter `current`, W: about 1 % of its rating (PRESET_IDLE_SHARE),
 * else, without a rating, the inverter's own idle draw, else none (undefined).
 */
export function presetIdleLoss(current: DraftElement): number | undefined {
  const rated = inverterRating(current);
  if (rated !== undefined) return Number((rated * PRESET_IDLE_SHARE).toPrecision(3));
  const loss = current['loss'] as Record<string, unknown> | undefined;
  return num(loss?.['idleLoss']);
}

/**
 * The preset at `efficiency` for the inverter `current` (its id is replaced when it is swapped in), with
 * the idle draw `idleLoss` (W; default presetIdleLoss).
 */
export function inverterPreset(current: DraftElement, efficiency: number, idleLoss: number | undefined = presetIdleLoss(current)): DraftElement {
  const rated = inverterRating(current);
  const keep = ['phases', 'outputVoltage', 'frequency', 'lowVoltageCutoff', 'ratedOutputPower', 'surge'] as const;
  const side: Record<string, unknown> = {};
  for (const k of keep) if (current[k] !== undefined) side[k] = current[k];
  const pct = Math.round(efficiency * 100);
  return {
    id: `${current.id}-${pct}`,
    name: `Inverter ${pct} %`,
    kind: 'inverter',
    ...side,
    loss: { model: 'constant', efficiency, ...(idleLoss !== undefined ? { idleLoss } : {}), ...(rated !== undefined ? { ratedPower: rated } : {}) },
  } as DraftElement;
}
