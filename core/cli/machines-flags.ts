/**
 * The command-line hook of core/studies/machines (pure: cli.ts reads the files).
 * `--machines`: motor and drive details, and the service-factor refusal.
 * `--pump-duty <study.json>`: the flow-control comparison of a pump study file (a PumpDutyInput).
 * A project with a `pumpDuty` ({ pump, duty }) runs the same comparison on its own pump, motor and
 * drive (core/studies/machines/pump-duty.ts) unless --pump-duty gives a study file, which then replaces it.
 * A project with `pump` elements gets their operating points and tree checks (`pumps`).
 * With --json they appear under `machines`, `pumpDuty`, `pumps` and `fans`.
 */
import type { Problem } from '../model/errors.ts';
import { solveWithMachines, type MachineDetails } from '../studies/machines/details.ts';
import { comparePumpControl, type PumpControlResult, type PumpDutyInput } from '../physics/pump-fan.ts';
import { formatPumpDuty, formatMachines } from '../studies/machines/text-report.ts';
import { fanDetails, projectPumpDuty, pumpDetails, type FanDetail, type PumpDetail } from '../studies/machines/pump-duty.ts';
import type { Solved } from '../solve/index.ts';
import { studiesOf } from '../kinds/index.ts';

/** Whether the project asks for the pump sections without a flag: a `pumpDuty`, or an element whose kind takes part in the pump duty study. */
export function hasPumpSections({ project }: Solved): boolean {
  return project.pumpDuty !== undefined || studiesOf(project.elements).has('pump-duty');
}

/** Plain text of the pumps' operating points and tree checks. */
export function formatPumps(pumps: readonly PumpDetail[]): string {
  const lines = ['Pumps (constant pump efficiency, affinity laws; quadratic pump curve, system curve H_s + k·Q²):'];
  for (const d of pumps) {
    const op = d.operatingPoint;
    lines.push(
      `  ${d.name} [${d.id}] ${op.control === 'speed' ? 'speed control' : 'throttled'}: ${op.flow} m³/s at ${op.head.toFixed(2)} m, speed ${(100 * op.speed).toFixed(1)} %, hydraulic ${(op.hydraulicPower / 1000).toFixed(2)} kW, shaft ${(op.shaftPower / 1000).toFixed(2)} kW (motor "${d.motorId}"${d.driveId ? `, drive "${d.driveId}"${d.driveSpeed !== undefined ? ` at ${(100 * d.driveSpeed).toFixed(1)} %` : ''}` : ', no drive'})`,
    );
    for (const w of d.warnings) lines.push(`    warning: ${w}`);
  }
  return lines.join('\n');
}

/** The fans' operating points and tree checks, for the CLI (Pa, m³/s as the file carries them). */
export function formatFans(fans: readonly FanDetail[]): string {
  const lines = ['Fans (constant fan efficiency, affinity laws; quadratic fan curve, no static pressure):'];
  for (const d of fans) {
    const op = d.operatingPoint;
    lines.push(
      `  ${d.name} [${d.id}] ${op.control === 'speed' ? 'speed control' : 'outlet damper'}: ${op.flow} m³/s at ${op.pressure.toFixed(0)} Pa, speed ${(100 * op.speed).toFixed(1)} %, shaft ${(op.shaftPower / 1000).toFixed(2)} kW (motor "${d.motorId}"${d.driveId ? `, drive "${d.driveId}"` : ', no drive'})`,
    );
    for (const w of d.warnings) lines.push(`    warning: ${w}`);
  }
  return lines.join('\n');
}

export const MACHINE_USAGE = '[--machines] [--pump-duty <pump-study.json>]';

export type MachineFlags = { ok: true; rest: string[]; machines: boolean; pumpDutyFile?: string } | { ok: false; message: string };

/** Take --machines and --pump-duty <file> out of the argument list (`--flow`, its spelling before format 2, is still read). */
export function takeMachineFlags(args: readonly string[]): MachineFlags {
  const rest: string[] = [];
  let machines = false;
  let pumpDutyFile: string | undefined;
  for (let i = 0; i < args.length; i++) {
    const a = args[i]!;
    if (a === '--machines') machines = true;
    else if (a === '--pump-duty' || a === '--flow') {
      const f = args[i + 1];
      if (f === undefined || f.startsWith('--')) return { ok: false, message: `${a} needs the pump study file after it` };
      pumpDutyFile = f;
      i++;
    } else rest.push(a);
  }
  return { ok: true, rest, machines, ...(pumpDutyFile !== undefined ? { pumpDutyFile } : {}) };
}

export type MachineSections =
  | { ok: true; text: string; json: { machines?: MachineDetails; pumpDuty?: PumpControlResult; pumps?: PumpDetail[]; fans?: FanDetail[] } }
  | { ok: false; heading: string; problems: Problem[] };

/**
 * Run what the flags ask for on the solved project (and the parsed pump duty study, which is not part
 * of the project: comparePumpControl checks it, naming its fields).
 */
export function machineSections(solved: Solved, machines: boolean, pumpDuty: unknown): MachineSections {
  const text: string[] = [];
  const json: { machines?: MachineDetails; pumpDuty?: PumpControlResult; pumps?: PumpDetail[]; fans?: FanDetail[] } = {};
  if (machines) {
    const m = solveWithMachines(solved);
    if (!m.ok) return { ok: false, heading: 'the motors and drives cannot be reported:', problems: m.problems };
    json.machines = m.machines;
    text.push(formatMachines(m.machines));
  }
  if (hasPumpSections(solved)) {
    const pumps = pumpDetails(solved.project);
    if (pumps.length) {
      json.pumps = pumps;
      text.push(formatPumps(pumps));
    }
    const fans = fanDetails(solved.project);
    if (fans.length) {
      json.fans = fans;
      text.push(formatFans(fans));
    }
    if (pumpDuty === undefined && solved.project.pumpDuty !== undefined) {
      const f = projectPumpDuty(solved);
      if (!f.ok) return { ok: false, heading: 'the pump or fan duty study of the project cannot be run:', problems: f.problems };
      json.pumpDuty = f.result;
      text.push(formatPumpDuty(f.result));
    }
  }
  if (pumpDuty !== undefined) {
    const f = comparePumpControl(pumpDuty as PumpDutyInput);
    if (!f.ok) return { ok: false, heading: 'the pump duty study cannot be run:', problems: f.problems };
    json.pumpDuty = f.result;
    text.push(formatPumpDuty(f.result));
  }
  return { ok: true, text: text.map((t) => `\n${t}\n`).join(''), json };
}
