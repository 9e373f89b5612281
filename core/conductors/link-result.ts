/**
 * The result of one sized cable link and its working, step by step: the sizing for the design
 * current (core/conductors/size.ts) beside the operating figures of the chain solved with the
 * chosen size — the operating current, the estimated conductor temperature, the resistance at it,
 * the exact drop |V_s| − |V_r| of the two-bus solution (../physics/two-bus.ts) and the usual
 * approximation I·(R·cosθ + X·sinθ)·L, and the heat. Methods are named in size.ts's header and at
 * each step.
 */
import { type Complex, abs } from '../physics/complex.ts';
import type { CableStage, PortKind } from '../model/project.ts';
import type { ConductorResult, ConductorStep, GoverningRule } from '../model/result.ts';
import type { DesignCurrent } from './design-current.ts';
import type { PreparedConductor } from './prepare.ts';
import { CAUTION, type Choice, type LinkAngle } from './size.ts';
import { figure, sigText } from '../model/message.ts';

const SQRT3 = Math.sqrt(3);
const phaseCount = (kind: PortKind): number => (kind === 'ac3' ? 3 : 1);
const fmt = (x: number) => (Math.abs(x - Math.round(x)) < 1e-9 ? String(Math.round(x)) : x.toFixed(1));

/** The voltage-drop approximation I·(R·cosθ + X·sinθ)·L × 2 (DC, 1φ) or × √3 (3φ), V. */
export function approximateDrop(kind: PortKind, current: number, sets: number, length: number, r: number, x: number, sOut: Complex): number {
  const sMag = abs(sOut);
  const cos = sMag > 0 ? sOut.re / sMag : 1;
  const sin = sMag > 0 ? sOut.im / sMag : 0;
  const perSet = current / sets;
  if (kind === 'dc') return 2 * perSet * r * length;
  const k = kind === 'ac3' ? SQRT3 : 2;
  return k * perSet * length * (r * cos + x * sin);
}

const GOVERNING_WORDS: Record<GoverningRule, string> = {
  ampacity: 'ampacity governs: the next smaller size cannot carry the design current',
  'voltage-drop': 'voltage drop governs: the next smaller size carries the design current but drops too much',
  protection: 'protection governs: the next smaller size carries the design current but no device rule lets it be protected',
  'smallest-size': 'the smallest listed size meets every requirement',
  fixed: 'size fixed by the user; checked, not chosen',
};

/** What the operating point gives a link: from the chain solved with the chosen sizes. */
export interface Operating {
  vIn: Complex;
  vOut: Complex;
  sOut: Complex;
  /** Resistance per metre the solve used (at the estimated operating temperature). */
  rUsed: number;
  temperature: number;
  loss: number;
}

/** The full result of a link: the sizing for its design current and the operating figures beside it. */
export function conductorResult(
  p: PreparedConductor,
  e: CableStage,
  choice: Extract<Choice, { ok: true }>,
  dc: DesignCurrent,
  limitPercent: number,
  nominal: number,
  angle: LinkAngle,
  op: Operating,
): ConductorResult {
  const ev = choice.chosen;
  const cand = ev.candidate;
  const kind = p.kind;
  const sets = p.parallelSets;
  const m = phaseCount(kind);
  const vsMag = abs(op.vIn);
  const vrMag = abs(op.vOut);
  const current = vrMag > 0 ? abs(op.sOut) / m / vrMag : 0;
  const lineFactor = kind === 'ac3' ? SQRT3 : 1;
  const sending = vsMag * lineFactor;
  const exactVolts = (vsMag - vrMag) * lineFactor;
  const exactPercent = sending > 0 ? (100 * exactVolts) / sending : 0;
  const approxVolts = approximateDrop(kind, current, sets, e.length, op.rUsed, cand.x, op.sOut);
  const approxPercent = sending > 0 ? (100 * approxVolts) / sending : 0;
  const nec = p.spec.system === 'nec';
  const kindWords = kind === 'dc' ? 'DC current' : 'line current';
  const nominalWords = `${fmt(nominal)} V${kind === 'ac3' ? ' line-to-line' : ''}`;
  const steps: ConductorStep[] = [];
  const step = (label: string, value: number | string, unit: string, note: string) => steps.push({ label, value, unit, note });
  step('Design current', dc.design, 'A', dc.rule + (dc.fallback ? `; the equipment rule could not be used: ${dc.fallback}` : ''));
  step('Operating current', current, 'A', `${kindWords} through the link in the solved chain (for the heat and the exact drop; not the sizing basis)`);
  if (sets > 1) step('Design current per set', dc.design / sets, 'A', `${sets} identical sets in parallel share it equally${p.excluded ? `; ${p.excluded}` : ''}`);
  step('Table ampacity', cand.table, 'A', `${cand.size.label}: ${p.column}`);
  step('Ambient factor', p.ambientFactor, '', `${p.ambient} °C ambient`);
  step(nec ? 'Adjustment factor' : 'Grouping factor', p.groupingFactor, '', p.groupingNote);
  step('Corrected ampacity', cand.corrected, 'A', `${cand.table} A × ${p.ambientFactor} × ${p.groupingFactor} per conductor`);
  if (ev.termination && ev.terminationLimit !== undefined) {
    step('Termination column', ev.terminationLimit, 'A', `${cand.size.label} in the ${ev.termination.rating} °C column: ${ev.termination.rule}`);
  }
  const ampRule = !nec
    ? `must be at least the design current${ev.ampacityOk ? ' ✓' : ' ✗'}`
    : dc.stacked
      ? `after corrections and the termination column, must be at least the design current (${dc.basis === 'drive-input' ? 'NEC 430.122(A)' : dc.basis === 'motor-feeder' ? 'NEC 430.24' : 'NEC 430.22'})${ev.ampacityOk ? ' ✓' : ' ✗'}`
      : `the termination column must carry the design current before corrections and the corrected ampacity the load current (NEC 210.19(A)(1)(a)/(b), 215.2(A)(1))${ev.ampacityOk ? ' ✓' : ' ✗'}`;
  step('Ampacity of the link', ev.izTotal, 'A', `${ev.ampacity.toFixed(1)} A per set × ${sets} set${sets === 1 ? '' : 's'}; ${ampRule}`);
  const shownRating = ev.device.ok ? ev.device.rating : undefined;
  step('Protective device', shownRating ?? '—', shownRating === undefined ? '' : 'A', `${ev.device.note} (${p.deviceList})`);
  step(
    'Voltage drop, check',
    ev.check.volts,
    'V',
    `${p.methodCite}, at ${dc.base.toFixed(1)} A${kind === 'dc' ? '' : `, cosθ = ${angle.cos.toFixed(3)}`}: ${ev.check.percent.toFixed(3)} % of ${nominalWords}; allowed ${sigText(limitPercent, 3)} % ${ev.dropOk ? '✓' : '✗'}`,
  );
  step(
    'Conductor temperature (estimate)',
    op.temperature,
    '°C',
    `T = T_a + (T_max − T_a)·(I/I_z)² = ${p.ambient} + (${p.tMax} − ${p.ambient})·(${sigText(current / sets, 4)}/${sigText(cand.corrected, 4)})², at the operating current (typical estimate)`,
  );
  step(
    'Resistance at that temperature',
    op.rUsed * 1000,
    'Ω/km',
    `R_T = R_${p.tRef}·(1 + α(T − ${p.tRef})) = ${(cand.rRef * 1000).toPrecision(4)} Ω/km × (1 + ${p.alpha}·(${op.temperature.toFixed(1)} − ${p.tRef})), one conductor (${p.resistanceCite})`,
  );
  if (kind !== 'dc') step('Reactance', cand.x * 1000, 'Ω/km', `one conductor (${p.reactanceCite})`);
  step('Voltage drop, solved chain', exactVolts, 'V', `estimate at the operating temperature: |V_send| − |V_receive| from the phasor solve, ${exactPercent.toFixed(3)} % of ${figure(sending, 1)} V${kind === 'ac3' ? ' line-to-line' : ''}`);
  const formula =
    kind === 'dc'
      ? `2 × ${sigText(e.length, 4)} m × ${(op.rUsed * 1000).toPrecision(4)} Ω/km × ${(current / sets).toFixed(2)} A (DC loop)`
      : `${kind === 'ac3' ? '√3' : '2'} × I·(R·cosθ + X·sinθ)·L at the operating current and temperature`;
  step('Voltage drop, approximate', approxVolts, 'V', `${formula}: ${approxPercent.toFixed(3)} %`);
  step('Loss', op.loss, 'W', `I²R of the ${kind === 'ac3' ? 'three phase conductors' : 'go and return conductors'}${sets > 1 ? `, all ${sets} sets` : ''}, at the operating current`);
  const rejectedWords = choice.rejected.length ? `; ${choice.rejected.slice(-2).map((r) => `${r.label}: ${r.why}`).join('; ')}` : '';
  step('Size', cand.size.label, '', `${GOVERNING_WORDS[choice.governing]}${rejectedWords}`);
  return {
    system: p.spec.system,
    material: p.spec.material,
    size: cand.size.label,
    areaMm2: cand.size.areaMm2,
    auto: p.auto,
    governing: choice.governing,
    parallelSets: sets,
    current,
    operatingCurrent: current,
    designCurrent: dc.design,
    designBasis: { basis: dc.basis, baseCurrent: dc.base, factor: dc.factor, stacked: dc.stacked, rule: dc.rule, ...(dc.fallback ? { fallback: dc.fallback } : {}) },
    nominalVoltage: nominal,
    ampacity: {
      table: cand.table,
      column: p.column + (ev.termination ? `, limited by the ${ev.termination.rating} °C termination column` : ''),
      ambientFactor: p.ambientFactor,
      groupingFactor: p.groupingFactor,
      corrected: cand.corrected,
      ...(ev.terminationLimit !== undefined ? { terminationLimit: ev.terminationLimit } : {}),
      ...(ev.termination ? { terminationColumn: ev.termination } : {}),
      perSet: ev.ampacity,
      total: ev.izTotal,
    },
    drop: {
      exactVolts,
      exactPercent,
      approxVolts,
      approxPercent,
      differenceVolts: approxVolts - exactVolts,
      differencePercent: approxPercent - exactPercent,
      limitPercent,
      checkVolts: ev.check.volts,
      checkPercent: ev.check.percent,
      checkMethod: `${p.methodCite}, at ${dc.base.toFixed(1)} A, % of ${nominalWords}`,
    },
    resistance: {
      referencePerKm: cand.rRef * 1000,
      referenceTemperature: p.tRef,
      operatingTemperature: op.temperature,
      perKm: op.rUsed * 1000,
      method: `R_T = R_ref·(1 + α(T − T_ref)), α = ${p.alpha}/°C referred to ${p.tRef} °C; T = T_a + (T_max − T_a)·(I/I_z)² (typical estimate)`,
    },
    reactancePerKm: kind === 'dc' ? 0 : cand.x * 1000,
    loss: op.loss,
    device: {
      // A device the rules do not allow on this size (a fixed size) is not shown as a rating.
      ...(ev.device.rating !== undefined && ev.device.ok ? { rating: ev.device.rating } : {}),
      list: p.deviceList,
      note: ev.device.note,
      rule: ev.device.rule,
      ...(ev.device.coordination ? { coordination: ev.device.coordination } : {}),
    },
    steps,
    caution: CAUTION,
  };
}
