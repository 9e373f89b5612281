/**
 * The answers model (core/solve/answers.ts, core/studies/answers.ts) against the demos and the
 * studies' own figures: every answer is the study's figure (runtime, sized bank, conductor size,
 * device and drop, start verdict, yearly cost), the bank's cable-and-fuse current is the design
 * current of the conductor sizing where the bank's cable has one, and the loss split is checked on a
 * hand-worked chain.
 */
import { describe, expect, it } from 'vitest';
import { demoProjects } from '../../core/demos/index.ts';
import { solveAnswers } from '../../core/solve/answers.ts';
import { answerStudies } from '../../core/studies/answers.ts';
import { runBackupStudy } from '../../core/studies/backup/study.ts';
import { lossCostPerYear } from '../../core/studies/economics.ts';
import { studySurges } from '../../core/studies/surge/index.ts';
import { solvedOf } from './solved.ts';

const near = (a: number, b: number, rel = 1e-9) => expect(Math.abs(a - b)).toBeLessThanOrEqual(rel * Math.max(1, Math.abs(b)));

const demo = (id: string) => {
  const d = demoProjects.find((x) => x.id === id);
  if (!d) throw new Error(`no demo ${id}`);
  return d.project as unknown as { elements: Record<string, unknown>[] } & Record<string, unknown>;
};

describe('answers of the demos equal the studies’ own figures', () => {
  for (const d of demoProjects) {
    const solved = solvedOf(d.project);
    const a = solveAnswers(solved);
    const cost = { pricePerKWh: 0.25, hoursPerYear: 8760 };
    const s = answerStudies(solved, cost);

    it(`${d.id}: source, loads, losses and efficiency are the solve's totals; the loss split adds up to them`, () => {
      const t = solved.result.totals;
      expect(a.source.power).toBe(t.sourcePower);
      expect(a.source.loadPower).toBe(t.loadPower);
      expect(a.source.efficiency).toBe(t.efficiency);
      near(a.losses.idle + a.losses.conversion + a.losses.cables + a.losses.source, t.losses, 1e-12);
      // Cables: Σ the cable elements' loss; idle: Σ the stages' idleLoss (core/solve/idle.ts).
      near(a.losses.cables, solved.result.elements.filter((e) => e.kind === 'cable').reduce((x, e) => x + e.loss, 0), 1e-12);
      near(a.losses.idle, solved.result.elements.reduce((x, e) => x + (e.idleLoss ?? 0), 0), 1e-12);
    });

    it(`${d.id}: each sized cable's answer is its conductor sizing (size, device, drop, governing rule)`, () => {
      const sized = solved.result.elements.filter((e) => e.conductor);
      expect(a.cables.map((c) => c.elementId)).toEqual(sized.map((e) => e.id));
      for (const e of sized) {
        const c = a.cables.find((x) => x.elementId === e.id)!;
        expect(c.size).toBe(e.conductor!.size);
        expect(c.deviceRating).toBe(e.conductor!.device.rating);
        expect(c.dropPercent).toBe(e.conductor!.drop.checkPercent);
        expect(c.governing).toBe(e.conductor!.governing);
      }
    });

    it(`${d.id}: runtime, bank for the target, start verdicts and yearly cost are the studies' figures`, () => {
      const backup = runBackupStudy(solved);
      if (backup.ok) {
        const b = s.banks[0]!;
        expect(b.runtimeSeconds).toBe(backup.study.discharge.runtimeSeconds);
        expect(b.peakCurrent).toBe(backup.study.discharge.peakCurrent);
        expect(b.sizedCapacityAh).toBe(backup.study.sizing?.bankCapacity);
      } else expect(s.banks).toEqual([]);
      const surge = studySurges(solved);
      expect(surge.ok).toBe(true);
      if (surge.ok) expect(s.starts.map((x) => [x.elementId, x.verdict])).toEqual(surge.result.starts.map((x) => [x.motorId, x.verdict]));
      const lc = lossCostPerYear(solved.result, cost);
      expect(lc.ok && s.cost.ok && s.cost.cost === lc.cost.totalCost).toBe(true);
    });
  }

  it('hillside relay hut: the runtime meets the 24 h target; the bank current is the highest discharge current, above the solve’s', () => {
    const solved = solvedOf(demo('hillside-relay-hut'));
    const s = answerStudies(solved, null);
    const b = s.banks[0]!;
    // The demo asks for 24 h (its backup settings); the study gives 27.7 h (tests/battery check the study itself).
    expect(b.targetSeconds).toBe(24 * 3600);
    expect(b.meetsTarget).toBe(true);
    // The bank's cable has no conductor sizing: the highest discharge current sets it, and for the
    // constant-power loads it is above the solve's bank current at the charged bank's voltage.
    expect(b.cableCurrent.basis).toBe('highest-discharge');
    expect(b.cableCurrent.amps).toBe(b.peakCurrent);
    expect(b.cableCurrent.amps).toBeGreaterThan(solveAnswers(solved).banks[0]!.operatingCurrent);
    expect(s.cost.ok).toBe(false);
  });

  it('riverside pump station: the 40 hp motor starts (behind its drive)', () => {
    const s = answerStudies(solvedOf(demo('riverside-pump-station')), null);
    expect(s.starts).toEqual([expect.objectContaining({ elementId: 'motor', verdict: 'starts', panel: 'starting' })]);
  });
});

describe('the bank’s cable and fuse current is the design current of the conductor sizing', () => {
  // The hillside demo with its bank cable sized by the NEC, and the DC-DC converter given its lowest
  // input voltage (40 V): the cable feeds a bus with two converters, so the engine takes the
  // equipment on the bus at its ratings, × 1.25 (NEC 706.30, 215.2(A)(1), as core/conductors/design-current.ts names it).
  const base = demo('hillside-relay-hut');
  const project = {
    ...base,
    elements: base.elements.map((e) =>
      e['id'] === 'bank-cable'
        ? { id: 'bank-cable', name: 'Bank to bus', kind: 'cable', from: 'bank', length: 3, conductor: { system: 'nec', material: 'copper', size: 'auto', insulationRating: 75 } }
        : e['id'] === 'radio-psu'
          ? { ...e, minInputVoltage: 40 }
          : e,
    ),
  };
  const solved = solvedOf(project);
  const quick = solveAnswers(solved);
  const bank = quick.banks[0]!;
  const cable = solved.result.elements.find((e) => e.id === 'bank-cable')!.conductor!;

  it('names the sizing’s design current, basis and rule, and the study answer takes it over the peak current', () => {
    expect(bank.cableCurrent).toBeDefined();
    expect(bank.cableCurrent!.amps).toBe(cable.designCurrent);
    expect(bank.cableCurrent!.basis).toBe('dc-feeder');
    expect(bank.cableCurrent!.factor).toBe(1.25);
    expect(bank.cableCurrent!.rule).toMatch(/NEC 706\.30/);
    const s = answerStudies(solved, null).banks[0]!;
    expect(s.cableCurrent).toEqual(expect.objectContaining({ basis: 'conductor-sizing', amps: cable.designCurrent, cableId: 'bank-cable' }));
  });

  it('equals the hand calculation from the converters’ ratings', () => {
    // Hand calculation (the converter input rule, NEC 690.8(A)/706.30 as design-current.ts applies it, I = P / (η·V_min)):
    // inverter: 3000 W rated, η at rated from its curve 0.915 with 25 W idle → 3000 / (3000/0.915 + 25) = 0.90808;
    //   3000 / (0.90808 × 44 V) = 75.083 A;
    // DC-DC: loss polynomial at 300 W: 3.5 + 0.03·300 + 0.00012·300² = 23.3 W → η = 300/323.3 = 0.92793;
    //   300 / (0.92793 × 40 V) = 8.0825 A;
    // design current = 1.25 × (75.083 + 8.0825) = 103.96 A.
    const etaInv = 3000 / (3000 / 0.915 + 25);
    const etaDc = 300 / (300 + 3.5 + 0.03 * 300 + 0.00012 * 300 ** 2);
    const expected = 1.25 * (3000 / (etaInv * 44) + 300 / (etaDc * 40));
    near(expected, 103.96, 1e-4);
    near(bank.cableCurrent!.amps, expected, 1e-9);
    // The choice: the device is the next standard rating at or above it (NEC 240.6(A): 110 A), the
    // size set by ampacity; and it is far above the solve's bank current (~10 A today's load).
    expect(bank.cableCurrent!.deviceRating).toBe(110);
    expect(cable.governing).toBe('ampacity');
    expect(bank.operatingCurrent).toBeLessThan(15);
  });
});

describe('loss split of a hand-worked chain', () => {
  // Invented: a stiff 48 V bank, 10 m of cable at 2 Ω/km (DC loop: go and return, R = 2 × 10 m × 2 Ω/km
  // = 0.04 Ω), a 48→12 V converter of constant 95 % with 5 W idle loss, a 190 W load.
  // Hand calculation:
  //   converter: P_in = 190 / 0.95 + 5 = 205 W → conversion 10 W, idle 5 W;
  //   cable: exact two-bus DC link with a constant-power load, V_r = (V_s + √(V_s² − 4·R·P)) / 2
  //   = (48 + √(2304 − 32.8)) / 2 = 47.8286 V; I = 205 / 47.8286 = 4.28614 A; loss I²R = 0.73485 W.
  const project = {
    format: 'joulepath-project',
    version: 2,
    name: 'Hand-worked split',
    elements: [
      { id: 'bank', kind: 'battery', voltage: 48 },
      { id: 'run', kind: 'cable', from: 'bank', length: 10, resistancePerKm: 2 },
      { id: 'psu', kind: 'dc-dc', from: 'run', outputVoltage: 12, loss: { model: 'constant', efficiency: 0.95, idleLoss: 5 } },
      { id: 'load', kind: 'dc-load', from: 'psu', power: 190 },
    ],
  };
  const a = solveAnswers(solvedOf(project));

  it('splits the losses into idle, conversion and cables as worked by hand', () => {
    const vr = (48 + Math.sqrt(48 ** 2 - 4 * 0.04 * 205)) / 2;
    const i = 205 / vr;
    near(vr, 47.8286, 1e-5);
    near(i * i * 0.04, 0.73485, 1e-4);
    near(a.losses.idle, 5, 1e-9);
    near(a.losses.conversion, 10, 1e-9);
    near(a.losses.cables, i * i * 0.04, 1e-9);
    expect(a.losses.source).toBe(0); // a stiff bank has no internal loss
    near(a.source.power, 205 + i * i * 0.04, 1e-9);
    expect(a.converters).toEqual([expect.objectContaining({ elementId: 'psu' })]);
    near(a.converters[0]!.efficiency, 190 / 205, 1e-9);
    // No conductor sizing on this cable: the bank answer names its cable, without a design current.
    expect(a.banks).toEqual([{ elementId: 'bank', name: 'bank', operatingCurrent: expect.any(Number), cableId: 'run', cableName: 'run' }]);
    near(a.banks[0]!.operatingCurrent, i, 1e-9);
  });
});
