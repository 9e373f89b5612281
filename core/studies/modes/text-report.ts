/**
 * Plain text of the modes study (a bank on a bus: on supply and on battery), for the command-line
 * solver (pure; no Node APIs). Numbers with sensible digits (sigText, figure of core/model/message.ts).
 */
import { figure, sigText } from '../../model/message.ts';
import type { ModeFigures, ModesStudyResult } from './study.ts';
import { CASE_WORDS } from './cables.ts';

const AH_FROM = { given: 'given', 'backup study': 'drawn from the bank in the backup study\u2019s outage', 'bank capacity': 'bank capacity' } as const;
const CASE_SHORT = { supply: 'on float', recharge: 'recharging', battery: 'on battery' } as const;

const w = (x: number): string => `${sigText(x, 4)} W`;
const a = (x: number): string => `${sigText(x, 4)} A`;
const v = (x: number): string => `${figure(x, 2)} V`;
const pct = (x: number): string => `${(x * 100).toFixed(2)} %`;

function modeLine(label: string, m: ModeFigures | { ok: false; problems: { message: string }[] }): string {
  if ('ok' in m) return `  ${label.padEnd(12)} cannot be solved: ${m.problems[0]?.message ?? 'no solution'}`;
  return `  ${label.padEnd(12)} source ${m.sourceName}: ${w(m.sourcePower)}, loads ${w(m.loadPower)}, losses ${w(m.losses)}, efficiency ${pct(m.efficiency)}, balance error ${m.balanceError.toExponential(1)}`;
}

/** Human-readable report of the modes study. */
export function formatModesStudy(s: ModesStudyResult): string {
  const out: string[] = ['', `Two modes: the bank "${s.bankName}" on the bus "${s.busName}"`];
  out.push(modeLine('On supply', s.supply), modeLine('On battery', s.battery));

  const c = s.charger;
  out.push('', `Charger sizing (${c.method})`);
  out.push(`  Charger: ${c.chargerName ?? 'none found above the bus'}`);
  out.push(`  L = ${a(c.loadCurrent)} continuous load on the bus; C = ${sigText(c.rechargeAh, 4)} Ah (${AH_FROM[c.rechargeAhFrom]}); H = ${sigText(c.rechargeHours, 3)} h; k = ${c.chargeReturnFactor}${c.chargeReturnFactorFrom === 'typical' ? ' (typical value: use the maker\u2019s figure)' : ''}`);
  out.push(`  Recharge current k·C/H = ${a(c.rechargeCurrent)}; charger capacity A = ${a(c.requiredCurrent)}`);
  if (c.modules) {
    const m = c.modules;
    out.push(`  Modules of ${a(m.moduleCurrent)}: ${m.needed} needed${m.redundancy === 'n+1' ? `, ${m.installed} with N+1` : ''} (${a(m.installedCurrent)} installed)`);
  }
  if (c.rechargeCase.ok) {
    const r = c.rechargeCase;
    out.push(`  Recharge case (the worst case): supply ${a(r.supplyCurrent)}, ${w(r.supplyPower)}${r.rectifierOutputCurrent !== null ? `; charger output ${a(r.rectifierOutputCurrent)}` : ''}`);
    for (const k of r.cables) out.push(`    ${k.name}: ${a(k.current)}${k.size ? `, ${k.size} (design current ${a(k.designCurrent!)})` : ''}`);
  } else {
    out.push(`  Recharge case cannot be solved: ${c.rechargeCase.problems[0]?.message ?? 'no solution'}`);
  }

  if (s.passThrough?.length) {
    out.push('', 'Pass-through on supply (inverter-charger)');
    for (const p of s.passThrough) {
      out.push(`  ${p.inverterName}: the loads take ${a(p.current)} through its relay (pass-through limit ${a(p.limit)}); inverter idle ${w(p.inverterIdle)}`);
      out.push(`    ${p.note}`);
    }
  }

  const st = s.standing;
  out.push('', 'Cost of standing by (on supply)');
  out.push(`  Standing losses ${w(st.total)}: conversion ${w(st.conversion)}, idle ${w(st.idle)}, cables ${w(st.cables)}, ${st.switches > 0 ? `transfer switches ${w(st.switches)}, ` : ''}supply ${w(st.source)}, bank float ${w(st.bankFloat)}`);
  out.push(`  ${sigText(st.hoursOnSupply, 4)} h a year on supply (${sigText(st.outageHoursPerYear, 3)} h of outage expected): ${sigText(st.energyKWh, 4)} kWh a year${st.cost !== undefined ? `, ${figure(st.cost, 2)} a year at ${sigText(st.pricePerKWh!, 3)} per kWh` : ''}`);

  const t = s.transfer;
  if (t) {
    out.push('', 'Transfer (the supply cut)');
    out.push(`  Bank on float: ${a(t.floatCurrent)} in (${t.floatCurrentNote}), EMF ${v(t.floatEmf)} behind ${sigText(t.internalResistance * 1000, 3)} mΩ`);
    out.push(`  At transfer: ${a(t.currentAtTransfer)} out, a step of ${a(t.currentStep)} (maximum discharge current ${a(t.maxDischargeCurrent)})`);
    out.push(`  Bus voltage: ${v(t.busVoltageOnSupply)} on supply, ${v(t.busVoltageAtTransfer)} at transfer${t.busVoltageSettled !== null ? `, ${v(t.busVoltageSettled)} settled on battery` : ''}`);
  }
  for (const k of s.switches) {
    out.push(`  ${k.name}: ${w(k.lossOnSupply)} on supply${k.lossOnBattery !== null ? `, ${w(k.lossOnBattery)} on battery` : ''}; ${k.note}`);
  }
  if (s.cables.length) {
    out.push('', 'Cable sizes across the modes (each the largest its cases need)');
    for (const k of s.cables) {
      const each = (['supply', 'recharge', 'battery'] as const).filter((c) => k.sizes[c] !== null).map((c) => `${k.sizes[c]} ${CASE_SHORT[c]}`);
      out.push(`  ${k.name}: ${k.governing}, sized for ${CASE_WORDS[k.governingCase]}${each.length > 1 ? ` (${each.join(', ')})` : ''}`);
    }
  }
  for (const x of s.warnings) out.push(`  Warning: ${x.message}`);
  out.push('  The studies below run on supply (the file as drawn), except the battery backup study, which runs on battery.');
  for (const x of s.cautions) out.push(`  Caution: ${x}`);
  return out.join('\n');
}
