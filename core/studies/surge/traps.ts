/**
 * Warnings for traps practitioners meet. Each says why it matters and what to check. They use the
 * engine's warning shape (`SolveWarning`, codes in core/model/result.ts) and come with the surge study.
 *
 * Rules (all common practice, no source — thresholds are this app's choice and stated in the text):
 * - Ah added across series strings: `capacityAh` is the capacity of ONE string. When a bank of
 *   `series` ≥ 2 units gives a capacity above what one unit of its form usually has (a block of
 *   several cells: 400 Ah; a single lithium cell: 400 Ah; a single lead-acid or NiCd cell: 3000 Ah)
 *   while capacityAh / series would be a usual size, the Ah were probably added along the string.
 * - One-way length in a DC drop: a DC link whose drop (go and return, as the engine counts it)
 *   exceeds its limit while half of it — the figure a check with the one-way length gives — passes.
 * - Inverter far oversized: load fraction below 10 %, or idle (no-load) loss above 10 % of the
 *   power it delivers.
 * - Drive fed single-phase: input on a single-phase interface with no `singlePhaseRating`, or
 *   loaded beyond it.
 * - Lithium charged below 0 °C: a lithium bank in a backup study with a charger and a cell
 *   temperature below the chemistry's minimum charge temperature.
 */
import type { Project } from '../../model/project.ts';
import type { SolveResult, SolveWarning } from '../../model/result.ts';
import { prepareLoss } from '../../physics/loss-model.ts';
import { bankValues } from '../../physics/bank.ts';
import { isLithium } from '../backup/cautions.ts';
import { linkLimit, resolveLimits } from '../../conductors/path-drop.ts';

/** Usual largest capacity of one unit (block or cell), Ah (common practice). */
const BLOCK_MAX_AH = 400;
const LITHIUM_CELL_MAX_AH = 400;
const OTHER_CELL_MAX_AH = 3000;
/** Inverter: light load and idle-loss share that count as "far oversized" (this app's rule). */
const OVERSIZED_LOAD_FRACTION = 0.1;
const OVERSIZED_IDLE_SHARE = 0.1;

const f3 = (x: number): string => x.toPrecision(3);

export function trapWarnings(project: Project, result: SolveResult): SolveWarning[] {
  const out: SolveWarning[] = [];
  const res = new Map(result.elements.map((e) => [e.id, e]));
  const limits = resolveLimits(project.dropLimits);
  for (const e of project.elements) {
    if (e.kind === 'battery' && e.bank) {
      const b = e.bank;
      const perBlock = (b.cellsPerBlock ?? 1) > 1;
      const max = perBlock ? BLOCK_MAX_AH : isLithium(b.chemistry) ? LITHIUM_CELL_MAX_AH : OTHER_CELL_MAX_AH;
      if (b.series >= 2 && b.capacityAh > max && b.capacityAh / b.series <= max) {
        const unit = perBlock ? 'block' : 'cell';
        out.push({
          code: 'ah-added-in-series',
          elementId: e.id,
          message: `bank.capacityAh ${b.capacityAh} Ah is more than one ${unit} of this kind usually holds (about ${max} Ah); Ah do not add in series — ${b.series} ${unit}s of ${f3(b.capacityAh / b.series)} Ah in series are still ${f3(b.capacityAh / b.series)} Ah. Check: enter the capacity of ONE ${unit} (one string); parallel strings go in bank.strings.`,
        });
      }
    }
    if (e.kind === 'cable') {
      const r = res.get(e.id);
      if (r?.input?.kind === 'dc' && r.input.voltage > 0 && r.output) {
        const drop = (100 * (r.input.voltage - r.output.voltage)) / r.input.voltage;
        const limit = linkLimit(e.conductor?.maxDropPercent, limits);
        if (drop > limit && drop / 2 <= limit) {
          out.push({
            code: 'dc-drop-one-way',
            elementId: e.id,
            message: `drops ${f3(drop)} %, above the ${limit} % limit; a check with the one-way length (${e.length} m) would show only about ${f3(drop / 2)} % and pass. A DC circuit carries the current out and back: the drop counts 2 × ${e.length} m. Check any hand calculation or the maker's table used the loop length, and that "length" is the one-way route length.`,
          });
        }
      }
    }
    if (e.kind === 'inverter') {
      const r = res.get(e.id);
      if (r) {
        const loss = e.loss;
        const idle = loss.model === 'polynomial' ? loss.p0 : loss.model === 'polynomial-fit' ? prepareLoss(loss).loss(0).loss : (loss.idleLoss ?? 0);
        const rated = loss.ratedPower;
        const x = rated !== undefined ? r.pOut / rated : undefined;
        const share = r.pOut > 0 ? idle / r.pOut : Infinity;
        if ((x !== undefined && x < OVERSIZED_LOAD_FRACTION) || (idle > 0 && share > OVERSIZED_IDLE_SHARE)) {
          out.push({
            code: 'inverter-oversized',
            elementId: e.id,
            message: `far larger than its load: it delivers ${f3(r.pOut)} W${x !== undefined ? ` (${f3(100 * x)} % of its ${f3(rated!)} W rating)` : ''} and its idle loss of ${f3(idle)} W is ${Number.isFinite(share) ? `${f3(100 * share)} %` : 'all'} of that. Idle loss runs all day and shortens battery runtime. Check a smaller inverter, or one with a low-power (search) mode, still covers the largest motor start.`,
          });
        }
      }
    }
    if (e.kind === 'drive') {
      const r = res.get(e.id);
      if (r?.input?.kind === 'ac1') {
        const s = r.output?.s ?? 0;
        if (e.singlePhaseRating === undefined) {
          out.push({
            code: 'drive-single-phase',
            elementId: e.id,
            message: 'is fed single-phase with no single-phase rating given: a three-phase drive on a single-phase supply must be derated (commonly to about half) because its rectifier and DC-link capacitors carry more ripple current. Check the maker allows single-phase input and enter its "Output rating on a single-phase supply".',
          });
        } else if (s > e.singlePhaseRating) {
          out.push({
            code: 'drive-single-phase',
            elementId: e.id,
            message: `is fed single-phase and delivers ${f3(s)} VA, above its single-phase rating of ${f3(e.singlePhaseRating)} VA: choose a larger drive or a three-phase supply.`,
          });
        }
      }
    }
  }
  const backup = project.backup;
  if (backup?.chargerCurrent !== undefined) {
    const t = backup.temperatureC ?? 25;
    for (const e of project.elements) {
      if (e.kind !== 'battery' || !e.bank || !isLithium(e.bank.chemistry)) continue;
      const min = bankValues(e.bank).values.minChargeTemperatureC;
      if (t < min) {
        out.push({
          code: 'lithium-charge-cold',
          elementId: e.id,
          message: `the backup study has a charger and a cell temperature of ${t} °C, below the ${min} °C this lithium bank may be charged at: charging below it plates lithium on the anode, which cuts capacity and can lead to internal shorts. Check the battery management system blocks charging below ${min} °C, or heat the cells.`,
        });
      }
    }
  }
  return out;
}
