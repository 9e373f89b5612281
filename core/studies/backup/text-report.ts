/**
 * Plain text of the battery backup study, for the command-line solver (pure; no Node APIs).
 */
import type { BackupStudyResult } from './study.ts';
import type { Derate } from './discharge.ts';

const hours = (s: number): string => {
  const h = s / 3600;
  if (h < 1) return `${(s / 60).toFixed(0)} min`;
  const whole = Math.floor(h);
  const min = Math.round((h - whole) * 60);
  return min === 60 ? `${whole + 1} h 00 min` : `${whole} h ${String(min).padStart(2, '0')} min`;
};
const n = (x: number, d = 1): string => x.toFixed(d);
const pct = (x: number): string => `${(x * 100).toFixed(0)} %`;

function derateLine(d: Derate): string {
  const value =
    d.unit === ''
      ? d.label.startsWith('Peukert') || d.label === 'temperature' || d.label.startsWith('aging')
        ? `× ${d.value.toFixed(3)}`
        : pct(d.value)
      : `${n(d.value, d.unit === 'V' ? 2 : 1)} ${d.unit}`;
  return `  ${d.label.padEnd(44)} ${value.padStart(12)}   ${d.note}`;
}

/** Human-readable report of the backup study. */
export function formatBackupStudy(study: BackupStudyResult): string {
  const d = study.discharge;
  const b = d.bank;
  const out: string[] = ['', 'Battery backup'];
  if (study.mode === 'battery') out.push('  Mode: on battery (the supply cut, the bank on its bus carries the loads)');
  out.push(
    `  Bank: ${b.label}, ${b.cellsInSeries} cells in series × ${b.strings} string(s), ${n(b.capacityAh, 0)} Ah (C${b.ratedHours}) — ${n(b.nominalVoltage)} V nominal, ${n(b.nominalWh, 0)} Wh, usable ${n(b.usableWh, 0)} Wh`,
    `  Internal resistance ${(b.internalResistance * 1000).toFixed(2)} mΩ; cut-off ${n(d.cutoffVoltage, 2)} V under load; start at ${pct(d.startSoc)} state of charge${b.overridden.length ? `; datasheet values: ${b.overridden.join(', ')}` : ''}`,
    '',
    `  Runtime: ${d.runtimeIsLowerBound ? 'longer than ' : ''}${hours(d.runtimeSeconds)} — ${d.endText}`,
    `  Delivered ${n(d.deliveredAh)} Ah, ${n(d.deliveredWh, 0)} Wh at the terminals; loads used ${n(d.loadWh, 0)} Wh; end state of charge ${pct(d.endSoc)}`,
    `  Peak current ${n(d.peakCurrent)} A (chemistry limit ${n(b.maxDischargeCurrent)} A); lowest terminal voltage ${n(d.minVoltage, 2)} V; ${d.series.time.length} points, ${d.timeStepSeconds} s steps`,
    '',
    '  Why not simply Wh ÷ W:',
    ...d.derates.map(derateLine),
  );
  for (const w of d.warnings) out.push(`  Warning: ${w}`);

  if (study.sizing) {
    const s = study.sizing;
    out.push(
      '',
      `Bank sizing (${s.method === 'energy' ? 'energy method' : s.method === 'ieee-485-worksheet' ? 'IEEE 485 duty-cycle worksheet' : 'IEEE 1115 duty-cycle worksheet'})`,
      `  ${s.summary}; governed by ${s.governing.kind === 'section' ? `worksheet section ${s.governing.section}` : s.governing.kind}`,
      `  ${s.basis}`,
    );
    const r = study.sizedDischarge;
    if (r) out.push(`  Runtime of this bank through the chain: ${r.runtimeIsLowerBound ? 'longer than ' : ''}${hours(r.runtimeSeconds)} — ${r.endText}`);
    if (study.sizingBasis) out.push(`  Duty cycle: ${study.sizingBasis}`);
    for (const st of s.steps) out.push(`  ${st.label.padEnd(44)} ${`${fmtStep(st.value)} ${st.unit}`.trim().padStart(14)}   ${st.note}`);
    if (s.sections.length) {
      const governing = s.governing.kind === 'section' ? s.governing.section : -1;
      out.push(`  Worksheet: ${s.sections.length} sections; largest F_S = ${n(Math.max(...s.sections.map((x) => x.total)))} Ah${governing > 0 ? ` (section ${governing})` : ''}`);
    }
    for (const w of s.warnings) out.push(`  Warning: ${w}`);
  }
  if (study.recharge) {
    const r = study.recharge;
    out.push(
      '',
      `Recharge with a ${n(r.chargerCurrent)} A charger: ${hours(r.time)} (constant current ${hours(r.constantCurrentTime)}, taper ${hours(r.constantVoltageTime)}), ${pct(r.startSoc)} → ${pct(r.endSoc)}`,
      `  ${n(r.loadCurrent)} A of it carries the standing load; ${n(r.bankCurrent)} A into the bank; AC input up to ${n(r.acInputPower, 0)} W, ${n(r.acInputEnergyWh, 0)} Wh`,
    );
    for (const w of r.warnings) out.push(`  Warning: ${w}`);
  }
  if (study.charger) {
    out.push('', `Charger for the target recharge time: at least ${n(study.charger.chargerCurrent)} A DC (recharge ${hours(study.charger.recharge.time)})`);
  }
  const cautions = new Set<string>([...d.cautions, ...(study.sizing?.cautions ?? []), ...(study.recharge?.cautions ?? [])]);
  out.push('', 'Cautions');
  for (const c of cautions) out.push(`  - ${c}`);
  return out.join('\n');
}

const fmtStep = (v: number): string => (Number.isInteger(v) ? String(v) : Math.abs(v) >= 100 ? v.toFixed(1) : v.toPrecision(4));
