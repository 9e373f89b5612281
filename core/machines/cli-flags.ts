/**
 * The command-line hook of core/machines (pure: cli.ts reads the files).
 * `--machines`: motor and drive details, and the service-factor refusal.
 * `--flow <study.json>`: the flow-control comparison of a pump study file (a FlowStudyInput).
 * With --json they appear under `machines` and `flowStudy`.
 */
import type { Problem } from '../errors.ts';
import { solveWithMachines, type MachineDetails } from './details.ts';
import { compareFlowControl, type FlowControlResult, type FlowStudyInput } from './flow-control.ts';
import { formatFlowStudy, formatMachines } from './text-report.ts';

export const MACHINE_USAGE = '[--machines] [--flow <pump-study.json>]';

export type MachineFlags = { ok: true; rest: string[]; machines: boolean; flowFile?: string } | { ok: false; message: string };

/** Take --machines and --flow <file> out of the argument list. */
export function takeMachineFlags(args: readonly string[]): MachineFlags {
  const rest: string[] = [];
  let machines = false;
  let flowFile: string | undefined;
  for (let i = 0; i < args.length; i++) {
    const a = args[i]!;
    if (a === '--machines') machines = true;
    else if (a === '--flow') {
      const f = args[i + 1];
      if (f === undefined || f.startsWith('--')) return { ok: false, message: '--flow needs the pump study file after it' };
      flowFile = f;
      i++;
    } else rest.push(a);
  }
  return { ok: true, rest, machines, ...(flowFile !== undefined ? { flowFile } : {}) };
}

export type MachineSections =
  | { ok: true; text: string; json: { machines?: MachineDetails; flowStudy?: FlowControlResult } }
  | { ok: false; heading: string; problems: Problem[] };

/** Run what the flags ask for on the parsed project (and the parsed flow study). */
export function machineSections(project: unknown, machines: boolean, flowStudy: unknown): MachineSections {
  const text: string[] = [];
  const json: { machines?: MachineDetails; flowStudy?: FlowControlResult } = {};
  if (machines) {
    const m = solveWithMachines(project);
    if (!m.ok) return { ok: false, heading: 'the motors and drives cannot be reported:', problems: m.problems };
    json.machines = m.machines;
    text.push(formatMachines(m.machines));
  }
  if (flowStudy !== undefined) {
    const f = compareFlowControl(flowStudy as FlowStudyInput);
    if (!f.ok) return { ok: false, heading: 'the flow-control study cannot be run:', problems: f.problems };
    json.flowStudy = f.result;
    text.push(formatFlowStudy(f.result));
  }
  return { ok: true, text: text.map((t) => `\n${t}\n`).join(''), json };
}
