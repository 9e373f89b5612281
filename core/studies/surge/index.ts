/**
 * Surges and faults: will each motor start on the chain that feeds it, what fault current can
 * flow at each interface, and can each protective device interrupt it. Plus the trap warnings
 * and cautions. Pure: project in, plain result out (contract in README.md beside this file).
 *
 * Steps, on the solved project (core/solve: never validated or solved again here) → battery fault currents (problems for a
 * zero internal resistance) → AC fault currents → device checks → each motor with `starting`
 * studied by re-solving the chain with its starting load → trap warnings → cautions.
 */
import type { MotorStage } from '../../model/project.ts';
import type { Problem } from '../../model/errors.ts';
import type { Solved } from '../../solve/index.ts';
import { AC_FAULT_METHOD, BATTERY_FAULT_METHOD, acFaults, batteryFaults, deviceChecks } from './faults.ts';
import { studyStart } from './starting.ts';
import { trapWarnings } from './traps.ts';
import { surgeCautions } from './cautions.ts';
import type { FaultPoint, MotorStartResult, SurgeOutcome } from './types.ts';

/** Run the surge and fault study on a solved project. Never throws on bad input. */
export function studySurges(solved: Solved): SurgeOutcome {
  const project = solved.project;
  const result = solved.result;
  const bat = batteryFaults(project, result);
  if (!bat.ok) return bat;
  const ac = acFaults(project, result);
  const atOutput = new Map<string, FaultPoint>([...bat.walk.atOutput, ...ac.walk.atOutput]);
  const starts: MotorStartResult[] = [];
  const problems: Problem[] = [];
  for (const e of project.elements) {
    if (e.kind !== 'motor' || !(e as MotorStage).starting) continue;
    const s = studyStart(solved, e as MotorStage);
    if (s.ok) starts.push(s.start);
    else problems.push(...s.problems);
  }
  if (problems.length) return { ok: false, problems };
  return {
    ok: true,
    result: {
      starts,
      batteryFaults: { method: BATTERY_FAULT_METHOD, ...(bat.walk.voltageBasis !== undefined ? { voltageBasis: bat.walk.voltageBasis } : {}), points: bat.walk.points },
      acFaults: { method: AC_FAULT_METHOD, voltageFactor: ac.voltageFactor, points: ac.walk.points },
      devices: deviceChecks(project, atOutput),
      warnings: trapWarnings(project, result),
      cautions: surgeCautions(project),
    },
  };
}

/** True when a solved project carries any input of this study (starting data, surge ratings, devices, fault data). */
export function hasSurgeInputs(solved: Solved): boolean {
  const keys = ['starting', 'surge', 'lowVoltageCutoff', 'protection', 'bankFuse', 'subtransientReactancePercent', 'transientReactancePercent', 'shortCircuitPower'];
  return solved.project.elements.some((e) => keys.some((k) => k in e));
}

export { formatSurgeStudy } from './text-report.ts';
export { startingFigures } from './starting.ts';
export { voltageFactor, AC_FAULT_METHOD, BATTERY_FAULT_METHOD } from './faults.ts';
export { trapWarnings } from './traps.ts';
export { surgeCautions, ARC_FLASH_CAUTION, DC_ARC_CAUTION, ESTIMATE_CAUTION } from './cautions.ts';
export type * from './types.ts';
