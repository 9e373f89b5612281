/**
 * Inverters to try in place of one in the chain: the editor's inverter template (web/editor/templates.ts,
 * a constant-efficiency inverter) at three efficiencies, on the AC side of the inverter it would replace
 * (its phases, output voltage and frequency, its cut-off, its rating). The efficiencies are typical
 * values to start from; the page says to use the maker's figure.
 */
import type { DraftElement } from '../../state/editor.ts';

/** Typical efficiencies of small sine-wave inverters, 92–96 % (common practice (no source)). */
export const PRESET_EFFICIENCIES = [0.92, 0.94, 0.96] as const;

const num = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? v : undefined);

/** The preset at `efficiency` for the inverter `current` (its id is replaced when it is swapped in). */
export function inverterPreset(current: DraftElement, efficiency: number): DraftElement {
  const loss = current['loss'] as Record<string, unknown> | undefined;
  const rated = num(loss?.['ratedPower']) ?? num(current['ratedOutputPower']);
  const keep = ['phases', 'outputVoltage', 'frequency', 'lowVoltageCutoff', 'ratedOutputPower', 'surge'] as const;
  const side: Record<string, unknown> = {};
  for (const k of keep) if (current[k] !== undefined) side[k] = current[k];
  const pct = Math.round(efficiency * 100);
  return {
    id: `${current.id}-${pct}`,
    name: `Inverter ${pct} %`,
    kind: 'inverter',
    ...side,
    loss: { model: 'constant', efficiency, ...(rated !== undefined ? { ratedPower: rated } : {}) },
  } as DraftElement;
}
