/** Plain text of the surge and fault study, for the command-line solver (pure; no Node APIs). */
import type { DeviceCheck, FaultPoint, MotorStartResult, SurgeStudyResult } from './types.ts';

const g = (x: number, d = 3): string => (Math.abs(x) >= 10 ** d ? Math.round(x).toString() : x.toPrecision(d));
const amps = (a: number): string => (a >= 1000 ? `${(a / 1000).toPrecision(3)} kA` : `${g(a)} A`);
const va = (s: number): string => (s >= 1000 ? `${(s / 1000).toPrecision(3)} kVA` : `${g(s)} VA`);
const VERDICT: Record<MotorStartResult['verdict'], string> = { starts: 'STARTS', marginal: 'MARGINAL', 'will-not-start': 'WILL NOT START' };

function startLines(s: MotorStartResult): string[] {
  const out = [
    `  ${s.name}${s.name !== s.motorId ? ` (${s.motorId})` : ""}, ${s.method}: ${VERDICT[s.verdict]} — ${s.governing}`,
    `    full-load ${amps(s.fullLoadCurrent)} (${s.fullLoadCurrentSource}); locked-rotor ${amps(s.lockedRotorCurrent)} (${s.lockedRotorSource})`,
    `    starting ${amps(s.startingCurrent)} = ${g(s.startingMultiple)} × FLC at pf ${g(s.startingPowerFactor, 2)} (${s.startingPowerFactorSource}); ${va(s.startingApparentPower)} at ${g(s.ratedVoltage)} V; ${g(s.startSeconds)} s (${s.startSecondsSource})`,
  ];
  if (s.sourceImpedance) out.push(`    source impedance during the start: ${s.sourceImpedance.basis}`);
  if (s.duringStart) {
    const d = s.duringStart;
    out.push(`    during the start: ${g(d.terminalVoltage)} V at the motor (${g(d.terminalVoltagePercent)} % of rated), ${amps(d.terminalCurrent)}`);
    if (d.seriesDrops.length) out.push(`      drops: ${d.seriesDrops.map((x) => `${x.kind} ${x.name} ${g(x.dropPercent)} %`).join(', ')}`);
    for (const c of d.cableDrops) out.push(`      cable ${c.id}: drop ${g(c.dropVolts)} V (${g(c.dropPercent)} %)`);
    if (d.cableDrops.length) out.push(`      cables together: ${g(d.cableDropTotalPercent)} %`);
  }
  if (s.inverter) {
    const i = s.inverter;
    out.push(`    inverter ${i.id}: ${va(i.apparentPower)} during the start${i.surgeRating !== undefined ? `, surge rating ${va(i.surgeRating)} for ${g(i.surgeSeconds!)} s` : ''}${i.inputVoltage !== undefined ? `; DC input ${g(i.inputVoltage)} V` : ''}${i.lowVoltageCutoff !== undefined ? ` (cut-off ${g(i.lowVoltageCutoff)} V)` : ''}`);
    if (i.battery) out.push(`    battery ${i.battery.id}: ${amps(i.battery.current)}, dip ${g(i.battery.dipVolts)} V over ${g(i.battery.internalResistance * 1000)} mΩ (${g(i.battery.openCircuitVoltage)} → ${g(i.battery.terminalVoltage)} V)`);
  }
  if (s.generator) {
    const gen = s.generator;
    out.push(`    generator ${gen.id}: starting ${va(gen.startingApparentPower)}${gen.ratedApparentPower !== undefined ? ` against ${va(gen.ratedApparentPower)} rating (× ${g(gen.startingToRating!)})` : ''}${gen.dipPercent !== undefined ? `; dip ${g(gen.dipPercent)} % behind ${gen.reactanceUsed === 'transient' ? 'X′d' : 'X″d'} (limit ${g(gen.maxDipPercent)} %)` : ''}${gen.reactanceUsed === 'transient' && gen.subtransientDipPercent !== undefined ? `; first cycles behind X″d ${g(gen.subtransientDipPercent)} %` : ''}`);
  }
  for (const c of s.checks) out.push(`    check ${c.label}: ${g(c.value)} ${c.unit} ${c.sense === 'at-least' ? '≥' : '≤'} ${g(c.limit)} ${c.unit} → ${c.status} (${c.limitSource})`);
  for (const n of s.notes) out.push(`    note: ${n}`);
  out.push(`    method: ${s.methodText}`);
  return out;
}

const faultLine = (p: FaultPoint): string =>
  `  ${`${p.elementId} ${p.location}`.padEnd(36)} ${p.portKind.padEnd(4)} ${g(p.voltage).padStart(7)} V  ${p.current === null ? 'not computed'.padStart(10) : amps(p.current).padStart(10)}  |Z| ${g(p.impedance * 1000)} mΩ${p.note ? `  (${p.note})` : ''}`;

const deviceLine = (d: DeviceCheck): string => `  ${d.elementId} ${d.label} at the ${d.location}: ${d.status.toUpperCase()} — ${d.message}`;

/** Human-readable report of the study. */
export function formatSurgeStudy(r: SurgeStudyResult): string {
  const out: string[] = ['', 'Surges and faults'];
  if (r.starts.length) {
    out.push('', ' Motor starting');
    for (const s of r.starts) out.push(...startLines(s));
  }
  if (r.batteryFaults.points.length) {
    out.push('', ' Battery prospective short-circuit current', ...(r.batteryFaults.voltageBasis ? [`  worked at ${r.batteryFaults.voltageBasis}`] : []), ...r.batteryFaults.points.map(faultLine), `  method: ${r.batteryFaults.method}`);
  }
  if (r.acFaults.points.length) {
    out.push('', ` AC available fault current (c = ${r.acFaults.voltageFactor})`, ...r.acFaults.points.map(faultLine), `  method: ${r.acFaults.method}`);
  }
  if (r.devices.length) out.push('', ' Protective devices', ...r.devices.map(deviceLine));
  if (r.warnings.length) out.push('', ' Warnings', ...r.warnings.map((w) => `  ${w.elementId}: ${w.message}`));
  out.push('', ' Cautions', ...r.cautions.map((c) => `  - ${c}`));
  return `${out.join('\n')}\n`;
}
