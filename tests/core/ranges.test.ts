/**
 * Plausible ranges (issue 15, point 10) and where a refusal lands.
 *
 * - Every number field of every kind (each kind below is given with all its optional fields) refuses
 *   1e300 at that very field, and the quantities of the range table name their plausible range with
 *   the unit (core/kinds/ranges.ts); a value at the bound passes.
 * - A link that cannot carry its load is named itself, not the source or feeder above it, also when
 *   its impedance is huge (a 100 km run of thin wire): the loss a link cannot have no longer reaches
 *   the elements upstream (seriesLink, core/kinds/spec.ts).
 *
 * The bounds are common practice (no source): generous limits, see the table's comments.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { solveProject } from '../../core/solve/index.ts';
import { validateProject } from '../../core/solve/validate.ts';
import { problemsForField, type DraftProject } from '../../web/state/editor.ts';
import { ABSOLUTE_ZERO_C, RANGES, boundText, rangeText, rangeWorded, type Quantity } from '../../core/kinds/ranges.ts';
import { valueText, type MessageUnit } from '../../core/model/message.ts';

type Json = Record<string, unknown>;
const project = (elements: unknown[], extra: Json = {}) => ({ format: 'joulepath-project', version: 2, name: 'ranges', elements, ...extra });
const demo = (id: string): Json => JSON.parse(readFileSync(`core/demos/${id}.json`, 'utf8'));

const curve = { model: 'curve', ratedPower: 3000, idleLoss: 20, points: [{ loadFraction: 0.2, efficiency: 0.9 }, { loadFraction: 1, efficiency: 0.95 }] };
const poly = { model: 'polynomial', p0: 10, k1: 0.01, k2: 0.00001, ratedPower: 5000 };
const fit = { model: 'polynomial-fit', ratedPower: 2000, points: [{ loadFraction: 0.1, efficiency: 0.85 }, { loadFraction: 0.5, efficiency: 0.94 }, { loadFraction: 1, efficiency: 0.93 }] };
const constant = { model: 'constant', efficiency: 0.95, idleLoss: 5, ratedPower: 1000 };

/** One element of every kind, each with every optional number field it can carry (invented values). */
const ELEMENTS: readonly Json[] = [
  { id: 'grid', kind: 'grid', phases: 3, voltage: 400, frequency: 50, resistance: 0.01, reactance: 0.02, ratedApparentPower: 1e5, shortCircuitPower: 1e7, shortCircuitRToX: 0.1, voltageTolerancePercent: 10 },
  { id: 'gen', kind: 'generator', phases: 3, voltage: 400, frequency: 50, resistance: 0.01, reactance: 0.05, ratedApparentPower: 5e4, subtransientReactancePercent: 15, transientReactancePercent: 25, maxDipPercent: 15 },
  { id: 'bat', kind: 'battery', voltage: 48, internalResistance: 0.02, bankFuse: { interruptingRating: 20000 } },
  {
    id: 'bank',
    kind: 'battery',
    bank: {
      chemistry: 'lifepo4',
      series: 16,
      strings: 2,
      cellsPerBlock: 1,
      capacityAh: 200,
      initialSoc: 0.9,
      overrides: {
        nominalCellVoltage: 3.2,
        endOfDischargeCellVoltage: 2.8,
        peukertExponent: 1.05,
        usableDepthOfDischarge: 0.9,
        internalResistanceOhmAh: 0.1,
        capacityVsTemperature: [{ temperatureC: -10, capacityFactor: 0.8 }, { temperatureC: 25, capacityFactor: 1 }],
        roundTripEfficiency: 0.95,
        ratedHours: 1,
        chargeCellVoltage: 3.55,
        floatCellVoltage: 3.4,
        maxChargeCRate: 0.5,
        maxDischargeCRate: 1,
        minChargeTemperatureC: 0,
      },
    },
  },
  { id: 'run', kind: 'cable', from: 'grid', length: 30, resistancePerKm: 0.5, reactancePerKm: 0.08, parallelSets: 2, protection: { interruptingRating: 25000 } },
  { id: 'nec', kind: 'cable', from: 'grid', length: 30, conductor: { system: 'nec', material: 'copper', size: 'auto', ambient: 40, maxDropPercent: 3, designCurrentBasis: 'given', designCurrent: 50, insulationRating: 75, currentCarryingConductors: 3 } },
  { id: 'iec', kind: 'cable', from: 'grid', length: 30, conductor: { system: 'iec', material: 'copper', size: 'auto', ambient: 30, insulation: 'pvc', installationMethod: 'C', loadedConductors: 3, groupedCircuits: 2 } },
  { id: 'xfmr', kind: 'transformer', from: 'grid', ratedApparentPower: 45000, primaryVoltage: 480, secondaryVoltage: 208, noLoadLoss: 150, loadLoss: 900, impedancePercent: 4 },
  { id: 'rect', kind: 'rectifier', from: 'grid', outputVoltage: 54, inputPowerFactor: 0.95, loss: curve, ratedOutputCurrent: 60 },
  { id: 'dc-dc', kind: 'dc-dc', from: 'bat', outputVoltage: 12, loss: poly, ratedOutputPower: 300, minInputVoltage: 36 },
  { id: 'bus', kind: 'dc-bus', from: 'bat', fixedLoss: 5 },
  { id: 'inv', kind: 'inverter', from: 'bat', phases: 1, outputVoltage: 230, frequency: 50, loss: fit, surge: { apparentPower: 6000, durationSeconds: 5 }, lowVoltageCutoff: 44, ratedOutputPower: 3000, passThroughLimit: 30 },
  { id: 'ats', kind: 'transfer-switch', from: 'grid', contactResistance: 0.0005, controlPower: 15, ratedCurrent: 63, transferTime: 0.004 },
  { id: 'vfd', kind: 'drive', from: 'grid', outputVoltage: 400, outputFrequency: 45, inputPowerFactor: 0.95, standardLoss: { ratedApparentPower: 30000, basis: 'cdm', points: [300, 310, 330, 360, 400, 450, 520, 600] }, motorRatedFrequency: 50, currentThd: 0.35, singlePhaseRating: 15000, ratedInputCurrent: 45 },
  { id: 'vfd2', kind: 'drive', from: 'grid', outputVoltage: 400, outputFrequency: 45, inputPowerFactor: 0.95, loss: constant },
  {
    id: 'motor',
    kind: 'motor',
    from: 'vfd',
    ratedOutput: 22000,
    efficiencyClass: 'IE3',
    ratedSpeed: 1470,
    ratedVoltage: 400,
    poles: 4,
    ratedFrequency: 50,
    ratedPowerFactor: 0.85,
    serviceFactor: 1.15,
    starting: { method: 'soft-starter', startingCurrentRatio: 7, currentLimit: 3.5, startingPowerFactor: 0.3, startSeconds: 10, minTerminalVoltagePercent: 80 },
  },
  { id: 'motor2', kind: 'motor', from: 'grid', ratedOutput: 7500, nameplate: { efficiency: 0.9, powerFactor: 0.84, current: 14 }, starting: { method: 'dol', lockedRotorCurrent: 90 } },
  { id: 'motor3', kind: 'motor', from: 'grid', ratedOutput: 7500, loss: constant, powerFactor: { model: 'curve', points: [{ loadFraction: 0.5, powerFactor: 0.75 }, { loadFraction: 1, powerFactor: 0.85 }] } },
  { id: 'gen-stage', kind: 'generic', from: 'bat', inputKind: 'dc', outputKind: 'ac1', outputVoltage: 230, outputFrequency: 60, inputPowerFactor: 1, loss: constant },
  { id: 'dc-load', kind: 'dc-load', from: 'bat', power: 100 },
  { id: 'ac-load', kind: 'ac-load', from: 'grid', power: 1000, powerFactor: 0.9 },
  { id: 'va-load', kind: 'ac-va-load', from: 'grid', apparentPower: 1000, powerFactor: 0.9 },
  { id: 'dc-i', kind: 'dc-current-load', from: 'bat', current: 10 },
  { id: 'ac-i', kind: 'ac-current-load', from: 'grid', current: 10, powerFactor: 0.9 },
  { id: 'shaft', kind: 'shaft-load', from: 'motor', power: 15000 },
  { id: 'pump', kind: 'pump', from: 'motor', ratedFlow: 0.05, ratedHead: 30, shutoffHead: 40, efficiency: 0.75, density: 998, staticHead: 10, flow: 0.04, control: 'speed' },
  { id: 'fan', kind: 'fan', from: 'motor', ratedFlow: 0.5, ratedPressure: 1000, shutoffPressure: 1300, efficiency: 0.7, density: 1.2, flow: 0.4, control: 'damper' },
];

/** Every number in an element, with its path as the problems give it ("loss.points.0.loadFraction"). */
function numberPaths(value: unknown, path: string[] = []): string[][] {
  if (typeof value === 'number') return [path];
  if (Array.isArray(value)) return value.flatMap((v, i) => numberPaths(v, [...path, String(i)]));
  if (typeof value === 'object' && value !== null) return Object.entries(value).flatMap(([k, v]) => numberPaths(v, [...path, k]));
  return [];
}

function withValue(element: Json, path: readonly string[], v: number): Json {
  const copy = structuredClone(element);
  let at: Record<string, unknown> = copy;
  for (const key of path.slice(0, -1)) at = at[key] as Record<string, unknown>;
  at[path[path.length - 1]!] = v;
  return copy;
}

/** Problems of one element validated alone (its feed is absent: those tree problems are not about its fields). */
const fieldProblems = (element: Json) => {
  const v = validateProject(project([element]));
  return v.ok ? [] : v.problems.filter((p) => p.elementId === element['id'] && p.code !== 'unknown-feed' && p.code !== 'missing-source');
};

describe('every number field refuses a value no power chain has', () => {
  it('the base elements pass their own checks (so each refusal below is the changed field\'s)', () => {
    for (const e of ELEMENTS) expect(fieldProblems(e), String(e['id'])).toEqual([]);
  });

  for (const e of ELEMENTS) {
    it(`${String(e['kind'])} "${String(e['id'])}": 1e300 in any number field is refused at that field`, () => {
      const paths = numberPaths(e).filter((p) => p[0] !== 'id');
      expect(paths.length).toBeGreaterThan(0);
      for (const path of paths) {
        const field = path.join('.');
        const problems = fieldProblems(withValue(e, path, 1e300));
        expect(problems.map((p) => p.field), field).toContain(field);
        for (const p of problems) expect(p.message).not.toMatch(/NaN|Infinity|Invalid input/);
      }
    });
  }
});

/** Fields read from the range table: element id, field path, quantity. */
const RANGED: readonly [string, string, Quantity][] = [
  ['grid', 'voltage', 'voltage'],
  ['grid', 'frequency', 'frequency'],
  ['grid', 'resistance', 'sourceOhms'],
  ['grid', 'ratedApparentPower', 'ratedApparentPower'],
  ['grid', 'shortCircuitPower', 'shortCircuitPower'],
  ['bat', 'voltage', 'voltage'],
  ['bat', 'bankFuse.interruptingRating', 'interruptingCurrent'],
  ['bank', 'bank.capacityAh', 'capacity'],
  ['bank', 'bank.strings', 'cellCount'],
  ['bank', 'bank.overrides.nominalCellVoltage', 'cellVoltage'],
  ['bank', 'bank.overrides.internalResistanceOhmAh', 'resistanceAh'],
  ['bank', 'bank.overrides.capacityVsTemperature.0.temperatureC', 'temperature'],
  ['bank', 'bank.overrides.minChargeTemperatureC', 'temperature'],
  ['bank', 'bank.overrides.ratedHours', 'hours'],
  ['bank', 'bank.overrides.maxChargeCRate', 'cRate'],
  ['run', 'length', 'length'],
  ['run', 'resistancePerKm', 'resistancePerKm'],
  ['run', 'reactancePerKm', 'reactancePerKm'],
  ['run', 'parallelSets', 'conductorCount'],
  ['nec', 'conductor.ambient', 'temperature'],
  ['nec', 'conductor.designCurrent', 'current'],
  ['xfmr', 'primaryVoltage', 'voltage'],
  ['xfmr', 'loadLoss', 'power'],
  ['xfmr', 'impedancePercent', 'impedancePercent'],
  ['rect', 'loss.ratedPower', 'ratedPower'],
  ['rect', 'loss.points.0.loadFraction', 'loadFraction'],
  ['dc-dc', 'loss.k1', 'lossK1'],
  ['dc-dc', 'loss.k2', 'lossK2'],
  ['inv', 'surge.durationSeconds', 'seconds'],
  ['vfd2', 'outputFrequency', 'frequency'], // vfd's own check bounds it by the motor's rated frequency
  ['vfd', 'standardLoss.points.3', 'power'],
  ['motor', 'ratedSpeed', 'speed'],
  ['motor3', 'ratedOutput', 'ratedPower'], // a class preset is bounded by its table
  ['ac-load', 'power', 'power'],
  ['va-load', 'apparentPower', 'apparentPower'],
  ['ac-i', 'current', 'current'],
  ['pump', 'ratedFlow', 'flow'],
  ['pump', 'shutoffHead', 'head'],
  ['pump', 'density', 'density'],
  ['fan', 'ratedPressure', 'pressure'],
  ['fan', 'density', 'density'],
];

describe('the range table: each message names the plausible range with its unit', () => {
  const byId = new Map(ELEMENTS.map((e) => [e['id'] as string, e]));
  for (const [id, field, q] of RANGED) {
    it(`${id}.${field}: above ${boundText(RANGES[q].max, RANGES[q])} refused, at it accepted`, () => {
      const e = byId.get(id)!;
      const path = field.split('.');
      const over = fieldProblems(withValue(e, path, RANGES[q].max * 10)).filter((p) => p.field === field);
      expect(over).toHaveLength(1);
      // The message writes its bounds as every message writes a value (core/model/message.ts: large
      // whole numbers grouped in threes); the schema's description keeps rangeText.
      const words = (v: number) => valueText({ si: v, unit: RANGES[q].unit as MessageUnit });
      expect(over[0]!.message).toContain(`must not exceed ${words(RANGES[q].max)}`);
      expect(over[0]!.message).toContain(`${RANGES[q].min === 0 ? `0${RANGES[q].unit ? ` ${RANGES[q].unit}` : ''}` : words(RANGES[q].min)} to ${words(RANGES[q].max)}`);
      expect(fieldProblems(withValue(e, path, RANGES[q].max)).filter((p) => p.field === field)).toEqual([]);
    });
  }

  it('a supply of 1e300 V is refused at its voltage, 1 MV at most (not "not a finite number" during the solve)', () => {
    const o = solveProject(project([{ id: 'mains', kind: 'grid', phases: 1, voltage: 1e300, frequency: 50 }, { id: 'l', kind: 'ac-load', from: 'mains', power: 100, powerFactor: 1 }]));
    expect(o.ok).toBe(false);
    if (!o.ok) expect(o.problems).toMatchObject([{ elementId: 'mains', field: 'voltage', message: expect.stringContaining('must not exceed 1 MV: the plausible range of a voltage is 0.1 V to 1 MV') }]);
  });

  it('a drive at 1e20 Hz is refused at its output frequency, 3 kHz at most', () => {
    const d = demo('riverside-pump-station');
    (d['elements'] as Json[]).find((e) => e['id'] === 'drive')!['outputFrequency'] = 1e20;
    const o = solveProject(d);
    expect(o.ok).toBe(false);
    if (!o.ok) expect(o.problems).toMatchObject([{ elementId: 'drive', field: 'outputFrequency', message: expect.stringContaining('must not exceed 3 kHz') }]);
  });

  it('the page\'s form field gets the same message (setField checks a value with problemsForField, web/state/editor.ts)', () => {
    const d = demo('riverside-pump-station');
    (d['elements'] as Json[]).find((e) => e['id'] === 'drive')!['outputFrequency'] = 1e20;
    const atField = problemsForField(d as unknown as DraftProject, 'drive', 'outputFrequency');
    expect(atField.map((p) => p.message)).toEqual(['must not exceed 3 kHz: the plausible range of a frequency is 0.1 Hz to 3 kHz (check the value and its unit)']);
  });

  it('an ambient below absolute zero (−273.15 °C, ISO 80000-5) says so; −80 °C is accepted', () => {
    const nec = ELEMENTS.find((e) => e['id'] === 'nec')!;
    const cold = fieldProblems(withValue(nec, ['conductor', 'ambient'], -300));
    expect(cold).toMatchObject([{ field: 'conductor.ambient', message: expect.stringContaining('below absolute zero (−273.15 °C)') }]);
    expect(ABSOLUTE_ZERO_C).toBe(-273.15);
    expect(fieldProblems(withValue(nec, ['conductor', 'ambient'], -81))[0]!.message).toContain('must be at least −80 °C');
    expect(fieldProblems(withValue(nec, ['conductor', 'ambient'], -80))).toEqual([]);
  });

  it('a zero or negative value keeps its own words ("must be greater than 0 V")', () => {
    const grid = ELEMENTS[0]!;
    expect(fieldProblems(withValue(grid, ['voltage'], 0))).toMatchObject([{ field: 'voltage', message: 'must be greater than 0 V' }]);
    expect(fieldProblems(withValue(grid, ['voltage'], 0.05))).toMatchObject([{ field: 'voltage', message: expect.stringContaining('must be at least 0.1 V') }]);
    const load = ELEMENTS.find((e) => e['id'] === 'ac-load')!;
    expect(fieldProblems(withValue(load, ['power'], -1))).toMatchObject([{ field: 'power', message: 'must not be negative W' }]);
  });

  it('a bank whose cells add up past 1 MV is refused at its series count', () => {
    const bank = ELEMENTS.find((e) => e['id'] === 'bank')!;
    // 10 000 cells × 1000 cells per block × 3.2 V = 32 MV open-circuit (LiFePO4 nominal 3.2 V per cell, maker data).
    const big = withValue(withValue(bank, ['bank', 'series'], 10_000), ['bank', 'cellsPerBlock'], 1000);
    const problems = fieldProblems(big);
    expect(problems).toMatchObject([{ field: 'bank.series', message: expect.stringContaining('must not exceed 1 MV') }]);
  });
});

describe('a refusal lands on the element that caused it', () => {
  /** The demo with one cable's run made long and thin (resistance given per km, no conductor sizing). */
  const withRun = (id: string, cable: string, length: number, ohmsPerKm: number) => {
    const d = demo(id);
    const e = (d['elements'] as Json[]).find((x) => x['id'] === cable)!;
    delete e['conductor'];
    e['length'] = length;
    e['resistancePerKm'] = ohmsPerKm;
    return d;
  };
  // Each pair: the run cannot carry its load (past the nose of its P–V curve; exact two-bus solution),
  // while the source and the elements above could carry that load without the run's loss.
  for (const [id, cable, length, ohms] of [
    ['hillside-relay-hut', 'bank-cable', 100_000, 10],
    ['hillside-relay-hut', 'bank-cable', 10_000, 100],
    ['hillside-relay-hut', 'hut-cable', 100_000, 10_000],
    ['riverside-pump-station', 'motor-cable', 100_000, 10],
    ['riverside-pump-station', 'motor-cable', 10_000, 100],
    ['riverside-pump-station', 'feeder', 100_000, 10_000],
  ] as const) {
    it(`${id}: ${cable} of ${length / 1000} km at ${ohms} Ω/km is named, not the source above it`, () => {
      const o = solveProject(withRun(id, cable, length, ohms));
      expect(o.ok).toBe(false);
      if (!o.ok) expect(o.problems.map((p) => [p.code, p.elementId])).toEqual([['infeasible-load', cable]]);
    });
  }

  it('a cable of 1e9 m is refused at its length (100 km at most), not on the bank', () => {
    const d = demo('hillside-relay-hut');
    (d['elements'] as Json[]).find((x) => x['id'] === 'bank-cable')!['length'] = 1e9;
    const o = solveProject(d);
    expect(o.ok).toBe(false);
    if (!o.ok) expect(o.problems).toMatchObject([{ elementId: 'bank-cable', field: 'length', message: expect.stringContaining('must not exceed 100 km') }]);
  });
});

describe('a fan’s flow range is worded as an air flow', () => {
  // The bounds of the range table (common practice, no source); the `air` mark makes the page show them
  // in the fan form's unit (m³/h or cfm), not a pump's gpm (web/format/message-text.ts).
  it('airFlow keeps the flow bounds and marks both quantities as air', () => {
    expect(RANGES.airFlow.max).toBe(RANGES.flow.max);
    const w = rangeWorded('airFlow', 2000, 'positive')!;
    expect(w.message).toContain('must not exceed');
    expect(w.values!.filter((v) => v.unit === 'm³/s').every((v) => v.air === true)).toBe(true);
    expect(rangeWorded('flow', 2000, 'positive')!.values!.some((v) => v.air)).toBe(false);
  });
});
