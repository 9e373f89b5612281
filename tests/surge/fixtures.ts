/** Small projects for the surge and fault tests (invented scenarios). */

export const project = (name: string, elements: unknown[], extra: Record<string, unknown> = {}) => ({ format: 'joulepath-project', version: 2, name, elements, ...extra });

/** 400 V stiff supply → cable (3.08 Ω/km, 0.09 Ω/km) of `length` m → 15 kW motor, DOL, 200 A locked rotor at pf 0.35. */
export function dolOnCable(length: number, starting: Record<string, unknown> = {}) {
  return project('DOL motor at the end of a cable', [
    { id: 'supply', kind: 'grid', phases: 3, voltage: 400, frequency: 50 },
    { id: 'run', kind: 'cable', from: 'supply', length, resistancePerKm: 3.08, reactancePerKm: 0.09 },
    {
      id: 'm',
      kind: 'motor',
      from: 'run',
      ratedOutput: 15000,
      ratedVoltage: 400,
      nameplate: { efficiency: 0.91, powerFactor: 0.85, current: 28 },
      starting: { method: 'dol', lockedRotorCurrent: 200, startingPowerFactor: 0.35, ...starting },
    },
    { id: 'load', kind: 'shaft-load', from: 'm', power: 12000 },
  ]);
}

/** 48 V LiFePO4 bank → cable → 5 kW 1φ inverter (10 kVA for 5 s surge) → cable → 1.1 kW pump motor, DOL, I_A/I_N 5. */
export function pumpOnInverter(opts: { surge?: number; surgeSeconds?: number; cutoff?: number; ratio?: number } = {}) {
  return project('well pump on an inverter', [
    { id: 'bank', kind: 'battery', voltage: 51.2, internalResistance: 0.004, bankFuse: { interruptingRating: 20000 } },
    { id: 'bank-cable', kind: 'cable', from: 'bank', length: 2, resistancePerKm: 0.34, protection: { interruptingRating: 10000 } },
    {
      id: 'inv',
      kind: 'inverter',
      from: 'bank-cable',
      phases: 1,
      outputVoltage: 230,
      frequency: 50,
      loss: { model: 'constant', efficiency: 0.93, idleLoss: 30, ratedPower: 5000 },
      surge: { apparentPower: opts.surge ?? 10000, durationSeconds: opts.surgeSeconds ?? 5 },
      lowVoltageCutoff: opts.cutoff ?? 44,
    },
    { id: 'pump-cable', kind: 'cable', from: 'inv', length: 40, resistancePerKm: 7.41, reactancePerKm: 0.1 },
    {
      id: 'pump-motor',
      kind: 'motor',
      from: 'pump-cable',
      ratedOutput: 1100,
      ratedVoltage: 230,
      nameplate: { efficiency: 0.8, powerFactor: 0.78, current: 7.7 },
      starting: { method: 'dol', startingCurrentRatio: opts.ratio ?? 5 },
    },
    { id: 'pump', kind: 'shaft-load', from: 'pump-motor', power: 900 },
  ]);
}

/**
 * 11 kV grid (S″kQ 250 MVA, R/X 0.1) → 500 kVA 11 kV/400 V transformer (u_k 5 %, 5 kW load loss) →
 * 30 m cable (0.193 + j0.08 Ω/km per conductor) → 40 kW load.
 */
export function gridTransformerCable(cableLength = 30, breaking = { board: 25000, far: 10000 }) {
  return project('substation board and a sub-feeder', [
    { id: 'grid', kind: 'grid', phases: 3, voltage: 11000, frequency: 50, shortCircuitPower: 250e6, shortCircuitRToX: 0.1 },
    { id: 'tx', kind: 'transformer', from: 'grid', ratedApparentPower: 500000, primaryVoltage: 11000, secondaryVoltage: 400, noLoadLoss: 800, loadLoss: 5000, impedancePercent: 5 },
    { id: 'board-feed', kind: 'cable', from: 'tx', length: 5, resistancePerKm: 0.0001, reactancePerKm: 0, protection: { interruptingRating: breaking.board } },
    { id: 'sub', kind: 'cable', from: 'board-feed', length: cableLength, resistancePerKm: 0.193, reactancePerKm: 0.08, protection: { interruptingRating: breaking.far } },
    { id: 'load', kind: 'ac-load', from: 'sub', power: 40000, powerFactor: 0.9 },
  ]);
}

/** 400 V supply of S″kQ 500 kVA (R/X 0.1) feeding one 30 kW IE3 motor directly, DOL; `starting` adds to its starting data. */
export const weakGrid = (starting: Record<string, unknown>, extra: Record<string, unknown> = {}) =>
  project('motor on a weak supply', [
    { id: 'grid', kind: 'grid', phases: 3, voltage: 400, frequency: 50, shortCircuitPower: 500e3, ...extra },
    { id: 'm', kind: 'motor', from: 'grid', ratedOutput: 30000, ratedVoltage: 400, efficiencyClass: 'IE3', poles: 4, ratedFrequency: 50, starting: { method: 'dol', ...starting } },
    { id: 'pump', kind: 'shaft-load', from: 'm', power: 25000 },
  ]);

/**
 * 11 kV supply (S″kQ 250 MVA, R/X 0.1) → 500 kVA 11 kV/400 V transformer (u_k 5 %, load loss 5 kW,
 * no core loss) → 60 m cable (0.193 + j0.08 Ω/km) → 90 kW motor, DOL, 1100 A locked rotor at pf 0.25.
 */
export const transformerFed = (impedancePercent: number | null = 5) =>
  project('motor behind a transformer', [
    { id: 'grid', kind: 'grid', phases: 3, voltage: 11000, frequency: 50, shortCircuitPower: 250e6, shortCircuitRToX: 0.1 },
    { id: 'tx', kind: 'transformer', from: 'grid', ratedApparentPower: 500000, primaryVoltage: 11000, secondaryVoltage: 400, noLoadLoss: 0, loadLoss: 5000, ...(impedancePercent !== null ? { impedancePercent } : {}) },
    { id: 'feed', kind: 'cable', from: 'tx', length: 60, resistancePerKm: 0.193, reactancePerKm: 0.08 },
    { id: 'm', kind: 'motor', from: 'feed', ratedOutput: 90000, ratedVoltage: 400, nameplate: { efficiency: 0.95, powerFactor: 0.87, current: 157 }, starting: { method: 'dol', lockedRotorCurrent: 1100, startingPowerFactor: 0.25 } },
    { id: 'fan', kind: 'shaft-load', from: 'm', power: 80000 },
  ]);

