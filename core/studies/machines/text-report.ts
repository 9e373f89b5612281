/** Plain-text report of motor/drive details and of the flow-control comparison (CLI). */
import type { MachineDetails } from './details.ts';
import type { PumpControlResult } from '../../physics/pump-fan.ts';

const pct = (x: number) => `${(x * 100).toFixed(1)} %`;
const kwh = (wh: number) => `${(wh / 1000).toFixed(0)} kWh`;
const kw = (w: number) => `${(w / 1000).toFixed(2)} kW`;

export const MACHINE_CAUTION =
  'Motor, drive, pump and fan figures are planning estimates from published tables and common-practice curves; the maker\'s data, local codes and licensed practice govern.';

export function formatMachines(m: MachineDetails): string {
  const out: string[] = ['Motors'];
  if (!m.motors.length) out.push('  (none)');
  for (const d of m.motors) {
    out.push(`  ${d.name}: load ${pct(d.loadFraction)} of rated (service factor ${d.serviceFactor}), efficiency ${pct(d.efficiency)}, power factor ${d.powerFactor.toFixed(3)}, line current ${d.lineCurrent.toFixed(2)} A`);
    out.push(`    full-load efficiency: ${d.efficiencySource}; power factor: ${d.powerFactorSource}`);
    if (d.estimatedFullLoadCurrent !== undefined) out.push(`    full-load current from the rating: ${d.estimatedFullLoadCurrent.toFixed(2)} A`);
    if (d.nameplateCurrent !== undefined) out.push(`    nameplate current: ${d.nameplateCurrent} A`);
    if (d.nec) out.push(`    NEC Table 430.250: ${d.nec.hp} hp at ${d.nec.voltage} V = ${d.nec.amps} A. ${d.nec.note}`);
    else out.push(`    NEC Table 430.250: not applied (${d.necNotApplicable ?? 'no row'})`);
  }
  out.push('Drives');
  if (!m.drives.length) out.push('  (none)');
  for (const d of m.drives) {
    const op = d.speedPercent !== undefined ? `at ${d.speedPercent.toFixed(1)} % ${d.basis === 'cdm' ? 'frequency' : 'speed'}, ${d.torquePercent!.toFixed(1)} % torque${d.clamped ? ' (outside the grid: edge value used)' : ''}, ` : '';
    out.push(`  ${d.name}: loss ${d.loss.toFixed(1)} W ${op}source: ${d.lossSource}`);
    out.push(
      `    input: displacement pf ${d.displacementPowerFactor.toFixed(3)}` +
        (d.truePowerFactor !== undefined ? `, THD_i ${pct(d.currentThd!)} → true pf ${d.truePowerFactor.toFixed(3)} (pf_disp/√(1+THD²), supply voltage taken as undistorted), rms current ${d.inputCurrentRms!.toFixed(2)} A` : '') +
        `; fundamental current ${d.inputCurrentFundamental.toFixed(2)} A`,
    );
  }
  out.push(MACHINE_CAUTION);
  return out.join('\n');
}

export function formatPumpDuty(r: PumpControlResult): string {
  // A fan's fixed-speed method is the outlet damper and its heads are given as pressures (core/physics/fan.ts).
  const fan = r.machine === 'fan';
  const fixed = fan ? 'outlet dampers' : 'throttling';
  const out: string[] = [fan ? 'Fan duty: flow control comparison (energy per year)' : 'Flow control comparison (energy per year)'];
  const at = fan ? `${(r.designPoint.pressure ?? Number.NaN).toFixed(0)} Pa` : `${r.designPoint.head.toFixed(1)} m`;
  out.push(`  design point: ${(r.designPoint.flow * 3600).toFixed(1)} m³/h at ${at}, shaft ${kw(r.designPoint.shaftPower)} (${pct(r.designPoint.motorLoadFraction)} of motor rating), input ${kw(r.designPoint.inputPower)}`);
  out.push(fan ? '  flow m³/h   hours   drive: speed  input        damper: input   on-off: run' : '  flow m³/h   hours   drive: speed  input      throttle: input   on-off: run');
  for (const p of r.points) {
    out.push(
      `  ${(p.flow * 3600).toFixed(1).padStart(9)} ${p.hours.toFixed(0).padStart(7)}   ${pct(p.speedControl.speed).padStart(11)}  ${kw(p.speedControl.inputPower).padStart(9)}  ${kw(p.throttle.inputPower).padStart(16)}  ${pct(p.onOffRunFraction).padStart(11)}`,
    );
  }
  out.push(`  speed control by drive: ${kwh(r.speedControl.energyWh)} (motor losses ${kwh(r.speedControl.motorLossWh)}, drive losses ${kwh(r.speedControl.driveLossWh)})`);
  out.push(`  ${`${fixed}:`.padEnd(23)} ${kwh(r.throttle.energyWh)} (motor losses ${kwh(r.throttle.motorLossWh)})`);
  out.push(`  on-off:                 ${kwh(r.onOff.energyWh)} (motor losses ${kwh(r.onOff.motorLossWh)})`);
  out.push(`  drive saves ${kwh(r.savingVsThrottleWh)} (${pct(r.savingVsThrottleFraction)}) against ${fixed} and ${kwh(r.savingVsOnOffWh)} (${pct(r.savingVsOnOffFraction)}) against on-off`);
  if (!fan) out.push(`  shaft energy with the static head: ${kwh(r.speedControlShaftEnergyWh)}; the bare cube law would claim ${kwh(r.cubeLawShaftEnergyWh)}`);
  out.push(`  motor: ${r.motorSource}; drive: ${r.driveSource}`);
  out.push(`  method: ${r.method}`);
  for (const w of r.warnings) out.push(`  warning: ${w}`);
  out.push(MACHINE_CAUTION);
  return out.join('\n');
}
