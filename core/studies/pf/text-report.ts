/**
 * Plain-text report of network loads and of a power-factor correction, for the command-line
 * solver (pure; no Node APIs).
 */
import type { NetworkLoadFigures } from '../../physics/network.ts';
import type { InterfaceState, PfCorrection, PfCorrectionRequest } from './correction.ts';
import { formatSi } from '../../physics/si-prefix.ts';

const n = (x: number, digits = 1): string => x.toFixed(digits);
const pf = (s: { powerFactor: number; pfSense: string }): string => `${s.powerFactor.toFixed(3)}${s.pfSense === 'unity' ? '' : ` ${s.pfSense === 'lagging' ? 'lag' : 'lead'}`}`;
const kw = (w: number): string => `${(w / 1000).toFixed(2)} kW`;
const kvar = (v: number): string => `${(v / 1000).toFixed(2)} kvar`;
const kva = (va: number): string => `${(va / 1000).toFixed(2)} kVA`;
const change = (before: number, after: number, unit: string, digits = 1): string => {
  const pct = before !== 0 ? ` (${after >= before ? '+' : ''}${(((after - before) / before) * 100).toFixed(1)} %)` : '';
  return `${n(before, digits)} → ${n(after, digits)} ${unit}${pct}`;
};

const CONNECTION_WORDS: Record<NetworkLoadFigures['connection'], string> = {
  'single-phase': 'across the supply',
  star: 'per phase, star',
  delta: 'per branch, delta',
};

/** One block per network load: its impedance and its figures. */
export function formatNetworkLoads(loads: readonly NetworkLoadFigures[]): string {
  if (loads.length === 0) return '';
  const out = ['Loads from circuit elements'];
  for (const l of loads) {
    const z = l.impedance;
    out.push(
      `  ${l.name}: ${l.components} component(s) at ${n(l.frequency, 2)} Hz, ${CONNECTION_WORDS[l.connection]}`,
      `    Z = ${z.r.toPrecision(5)} ${z.x < 0 ? '−' : '+'} j${Math.abs(z.x).toPrecision(5)} Ω, |Z| ${z.magnitude.toPrecision(5)} Ω at ${n(z.angleDeg, 2)}°`,
    );
    if (l.connection === 'delta') {
      const y = l.starEquivalent;
      out.push(`    star equivalent per phase: ${y.r.toPrecision(5)} ${y.x < 0 ? '−' : '+'} j${Math.abs(y.x).toPrecision(5)} Ω`);
    }
    out.push(
      `    ${n(l.networkVoltage)} V across it, ${n(l.networkCurrent, 2)} A through it (line current ${n(l.lineCurrent, 2)} A)`,
      `    P ${n(l.p)} W, Q ${n(l.q)} var, S ${n(l.s)} VA, pf ${pf(l)}`,
    );
  }
  return out.join('\n');
}

const stateLine = (label: string, s: InterfaceState): string =>
  `  ${label.padEnd(26)} ${n(s.voltage)} V, ${n(s.current, 2)} A, ${kw(s.p)}, ${kvar(s.q)}, ${kva(s.s)}, pf ${pf(s)}`;

/** The bank, the before/after comparison, the light-load check and the cautions. */
export function formatPfCorrection(c: PfCorrection): string {
  const b = c.bank;
  const where = c.side === 'input' ? `at the terminals of ${c.at}` : `at the output of ${c.at}`;
  const caps =
    b.capacitance.single !== undefined
      ? `${formatSi(b.capacitance.single, 'F')}`
      : `${formatSi(b.capacitance.star!, 'F')} per phase in star, ${formatSi(b.capacitance.delta!, 'F')} per phase in delta`;
  const out = [
    `Power-factor correction ${where} to ${c.targetPowerFactor} lagging`,
    `  Qc = P·(tan φ1 − tan φ2) = ${kvar(b.reactivePower)} at ${n(b.voltage)} V ${c.kind === 'ac3' ? 'line-to-line ' : ''}${n(b.frequency, 2)} Hz`,
    `  capacitance: ${caps}${c.kind === 'ac3' ? ` (re-solved in ${b.connection})` : ''}`,
    stateLine('before:', c.before),
    stateLine('after (by the formula):', c.afterEstimate),
    stateLine('after (re-solved):', c.afterSolved),
    `  light load: at ${(c.lightLoad.fraction * 100).toFixed(0)} % of the load the pf is ${pf(c.lightLoad)}; leading below ${(c.lightLoad.leadingBelowFraction * 100).toFixed(1)} % load`,
    '  upstream (current, loss):',
  ];
  for (const u of c.upstream) {
    const size = u.sizeBefore !== undefined ? `, conductor ${u.sizeBefore}${u.sizeAfter !== u.sizeBefore ? ` → ${u.sizeAfter}` : ''}` : '';
    out.push(`    ${u.name} (${u.kind}): ${change(u.currentBefore, u.currentAfter, 'A', 2)}; ${change(u.lossBefore, u.lossAfter, 'W')}${size}`);
  }
  const s = c.source;
  out.push(
    `  source: ${kw(s.pBefore)} → ${kw(s.pAfter)}, ${kvar(s.qBefore)} → ${kvar(s.qAfter)}, ${change(s.sBefore / 1000, s.sAfter / 1000, 'kVA', 2)}`,
    `  all losses: ${change(c.lossesBefore, c.lossesAfter, 'W')}`,
  );
  for (const w of c.warnings) out.push(`  warning: ${w}`);
  out.push(`  ${c.caution}`);
  return out.join('\n');
}

/** Read the command-line value `<elementId>:<target>` (the id may itself hold colons; the last one splits). */
export function parseCorrectPfFlag(value: string | undefined): { ok: true; request: PfCorrectionRequest } | { ok: false; message: string } {
  if (value === undefined || value.startsWith('--')) return { ok: false, message: '--correct-pf needs <elementId>:<target power factor>, e.g. --correct-pf pump-feeder:0.95' };
  const split = value.lastIndexOf(':');
  if (split <= 0 || split === value.length - 1) {
    return { ok: false, message: `--correct-pf "${value}": write <elementId>:<target power factor>, e.g. pump-feeder:0.95` };
  }
  const text = value.slice(split + 1).trim();
  const target = Number(text);
  if (text === '' || !Number.isFinite(target)) return { ok: false, message: `--correct-pf "${value}": the target power factor "${text}" is not a number` };
  return { ok: true, request: { at: value.slice(0, split), targetPowerFactor: target } };
}

/** The correction as JSON for the command line: without the two full results (the main output already has the first). */
export function pfCorrectionJson(c: PfCorrection): Omit<PfCorrection, 'resultBefore' | 'resultAfter' | 'correctedProject'> {
  const { resultBefore: _before, resultAfter: _after, correctedProject: _project, ...rest } = c;
  return rest;
}
