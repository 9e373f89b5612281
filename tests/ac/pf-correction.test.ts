/**
 * Power-factor correction (core/studies/pf/correction.ts).
 *
 * Check values are worked by hand (calculator) from the published relations:
 * - bank rating Qc = P·(tan φ1 − tan φ2) (IEEE Std 1036, Guide for the Application of Shunt Power
 *   Capacitors; the same relation in any power-systems handbook);
 * - capacitance from Q = V²·ωC per capacitor: delta C = Qc/(3ωV_LL²), star C = Qc/(3ωV_phase²),
 *   single-phase C = Qc/(ωV²) (the same sources);
 * - line current I = P/(√3·V_LL·pf) (three-phase power, any handbook);
 * - I²R loss of a series conductor (Joule's law): loss after/loss before = (I after/I before)².
 */
import { describe, expect, it } from 'vitest';
import { PROJECT_LEVEL } from '../../core/model/errors.ts';
import {
  bankCapacitance,
  correctPowerFactor,
  leadingBelowFraction,
  pfCorrectionCandidates,
  requiredReactivePower,
  solveProject,
  type PfCorrection,
  type Project,
} from '../../core/index.ts';
import { onSolved } from '../core/solved.ts';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
const project = (elements: unknown[]): Project => ({ format: 'joulepath-project', version: 2, name: 'pf test', elements }) as Project;

function corrected(p: unknown, request: Parameters<typeof correctPowerFactor>[1]): PfCorrection {
  const out = onSolved(correctPowerFactor, p, request);
  if (!out.ok) throw new Error(JSON.stringify(out.problems));
  return out.correction;
}

/** 100 kW at pf 0.75 lagging on a stiff 400 V 50 Hz three-phase supply. */
const stiff = project([
  { id: 'sup', kind: 'grid', phases: 3, voltage: 400, frequency: 50 },
  { id: 'mill', kind: 'ac-load', from: 'sup', power: 100_000, powerFactor: 0.75 },
]);

describe('the formulas, worked by hand', () => {
  it('Qc = P·(tan φ1 − tan φ2): 100 kW from 0.75 to 0.95 needs 55.32 kvar', () => {
    // tan(arccos 0.75) = √0.4375/0.75 = 0.881917; tan(arccos 0.95) = √0.0975/0.95 = 0.328684;
    // Qc = 100 kW × 0.553233 = 55.3233 kvar (hand).
    expect(rel(requiredReactivePower(100_000, 0.75, 0.95), 55_323.3)).toBeLessThan(1e-6);
    // 2 kW from 0.6 to 0.9: tan φ1 = 0.8/0.6 = 1.333333, tan φ2 = √0.19/0.9 = 0.484322; Qc = 2000 × 0.849011 = 1698.022 var (hand).
    expect(rel(requiredReactivePower(2000, 0.6, 0.9), 1698.022)).toBeLessThan(1e-6);
    // Target 1: Qc = Q = P·tan φ1 (hand): 10 kW at 0.8 → 7.5 kvar.
    expect(rel(requiredReactivePower(10_000, 0.8, 1), 7500)).toBeLessThan(1e-12);
  });

  it('capacitance per phase: 55.3233 kvar at 400 V 50 Hz is 366.87 µF in delta, 1100.62 µF in star', () => {
    // ω = 314.159265; delta: 55 323.3/(3 × 314.159 × 400²) = 366.874 µF;
    // star: 55 323.3/(3 × 314.159 × 230.940²) = 1100.622 µF (three times delta) (hand).
    expect(rel(bankCapacitance(55_323.3, 'delta', 400, 50), 366.874e-6)).toBeLessThan(1e-5);
    expect(rel(bankCapacitance(55_323.3, 'star', 400, 50), 1100.622e-6)).toBeLessThan(1e-5);
    // Single-phase: 1698.02 var at 230 V 50 Hz: 1698.02/(314.159 × 52 900) = 102.173 µF (hand).
    expect(rel(bankCapacitance(1698.02, 'single-phase', 230, 50), 102.173e-6)).toBeLessThan(1e-5);
  });

  it('light load: the fixed bank turns the pf leading below Qc/Q of the load', () => {
    // Q = 100 kW × 0.881917 = 88.1917 kvar; 55.3233/88.1917 = 0.627307 (hand).
    expect(rel(leadingBelowFraction(88_191.7, 55_323.3), 0.627307)).toBeLessThan(1e-5);
  });
});

describe('correctPowerFactor on a stiff supply (the interface voltage is exactly 400 V)', () => {
  const c = corrected(stiff, { at: 'mill', targetPowerFactor: 0.95 });

  it('the bank: kvar and µF per phase as worked by hand', () => {
    expect(rel(c.bank.kvar, 55.3233)).toBeLessThan(1e-6);
    expect(rel(c.bank.capacitance.delta!, 366.874e-6)).toBeLessThan(1e-5);
    expect(rel(c.bank.capacitance.star!, 1100.622e-6)).toBeLessThan(1e-5);
    expect(c.bank.capacitance.single).toBeUndefined();
    expect(c.bank.voltage).toBeCloseTo(400, 9);
    expect(c.bank.frequency).toBe(50);
    expect(c.side).toBe('input');
    expect(c.bankFrom).toBe('sup');
  });

  it('line current 192.45 A → 151.93 A, by the formula and in the re-solved chain', () => {
    // I = 100 000/(√3 × 400 × 0.75) = 192.450 A; after: 100 000/(√3 × 400 × 0.95) = 151.934 A (hand).
    expect(rel(c.before.current, 192.450)).toBeLessThan(1e-5);
    expect(rel(c.afterEstimate.current, 151.934)).toBeLessThan(1e-5);
    expect(rel(c.afterSolved.current, 151.934)).toBeLessThan(1e-5);
    expect(c.afterSolved.powerFactor).toBeCloseTo(0.95, 9);
    expect(c.afterSolved.pfSense).toBe('lagging');
    // The source now delivers 100 kW at pf 0.95: S = 105.263 kVA (100/0.95, hand).
    expect(rel(c.source.sAfter, 105_263.16)).toBeLessThan(1e-6);
    expect(rel(c.source.sBefore, 133_333.33)).toBeLessThan(1e-6);
  });

  it('light load at 25 %: pf 0.6007 leading; leading below 62.73 % load; a warning says so', () => {
    // At 25 %: P = 25 kW, Q = 22.0479 − 55.3233 = −33.2754 kvar; pf = 25/√(25² + 33.2754²) = 0.600668 (hand).
    expect(c.lightLoad.fraction).toBe(0.25);
    expect(c.lightLoad.powerFactor).toBeCloseTo(0.600668, 5);
    expect(c.lightLoad.pfSense).toBe('leading');
    expect(c.lightLoad.leadingBelowFraction).toBeCloseTo(0.627307, 5);
    expect(c.warnings.join('\n')).toMatch(/at 25 % of the present load .* overshoots: pf 0\.601 leading; it turns leading below 62\.7 % load/);
  });

  it('no overshoot warning when the light-load point stays lagging', () => {
    // 0.75 → 0.8: Qc = 100 kW × (0.881917 − 0.75) = 13.19 kvar; leading below 13.19/88.19 = 14.96 % (hand).
    const mild = corrected(stiff, { at: 'mill', targetPowerFactor: 0.8, lightLoadFraction: 0.3 });
    expect(mild.lightLoad.leadingBelowFraction).toBeCloseTo(0.149575, 5);
    expect(mild.lightLoad.pfSense).toBe('lagging');
    expect(mild.warnings.some((w) => w.includes('overshoots'))).toBe(false);
  });

  it('the bank in star in the re-solve gives the same correction', () => {
    const star = corrected(stiff, { at: 'mill', targetPowerFactor: 0.95, connection: 'star' });
    expect(star.bankElement.connection).toBe('star');
    expect(star.bankElement.network).toEqual({ capacitor: star.bank.capacitance.star });
    expect(star.afterSolved.powerFactor).toBeCloseTo(0.95, 9);
  });
});

describe('single-phase, and what correction changes upstream', () => {
  const feeder = project([
    { id: 'sup', kind: 'grid', phases: 1, voltage: 230, frequency: 50, resistance: 0.05, reactance: 0.08 },
    { id: 'run', kind: 'cable', from: 'sup', length: 45, resistancePerKm: 4.61, reactancePerKm: 0.1 },
    { id: 'washer', kind: 'ac-load', from: 'run', power: 2000, powerFactor: 0.6 },
    { id: 'lights', kind: 'ac-load', from: 'run', power: 600, powerFactor: 1 },
  ]);
  const c = corrected(feeder, { at: 'washer', targetPowerFactor: 0.9 });

  it('single-phase bank C = Qc/(ωV²) at the solved load voltage', () => {
    const v = c.before.voltage;
    expect(v).toBeLessThan(230); // the cable drops it
    // Qc = 2000 × (1.333333 − 0.484322) = 1698.022 var, whatever the voltage (constant-power load; hand).
    expect(rel(c.bank.reactivePower, 1698.022)).toBeLessThan(1e-6);
    expect(rel(c.bank.capacitance.single!, 1698.022 / (2 * Math.PI * 50 * v * v))).toBeLessThan(1e-6);
    expect(c.bank.connection).toBe('single-phase');
    expect(c.bankElement.connection).toBeUndefined();
  });

  it('lists the cable and the source with current and loss before and after; loss follows I² (Joule)', () => {
    expect(c.upstream.map((u) => u.id)).toEqual(['run', 'sup']);
    for (const u of c.upstream) {
      expect(u.currentAfter).toBeLessThan(u.currentBefore);
      expect(u.lossAfter).toBeLessThan(u.lossBefore);
      expect(rel(u.lossAfter / u.lossBefore, (u.currentAfter / u.currentBefore) ** 2)).toBeLessThan(1e-9);
    }
    expect(c.lossesAfter).toBeLessThan(c.lossesBefore);
    expect(c.source.sAfter).toBeLessThan(c.source.sBefore);
    expect(c.source.qAfter).toBeLessThan(c.source.qBefore);
    // The re-solved washer terminals reach the target to within the bank's voltage rise.
    expect(Math.abs(c.afterSolved.powerFactor - 0.9)).toBeLessThan(0.002);
    expect(c.resultAfter.elements.some((e) => e.id === 'washer-pf-bank')).toBe(true);
  });

  it('correction at the cable output covers everything it feeds', () => {
    const all = corrected(feeder, { at: 'run', targetPowerFactor: 0.95 });
    expect(all.side).toBe('output');
    expect(all.bankFrom).toBe('run');
    // P at the cable output = 2600 W (both loads, constant power; hand).
    expect(all.before.p).toBeCloseTo(2600, 6);
    expect(all.upstream.map((u) => u.id)).toEqual(['run', 'sup']);
  });

  it('a smaller conductor where the size is chosen automatically', () => {
    const sized = project([
      { id: 'sup', kind: 'grid', phases: 3, voltage: 400, frequency: 50 },
      { id: 'feed', kind: 'cable', from: 'sup', length: 120, conductor: { system: 'iec', material: 'copper', size: 'auto', insulation: 'pvc', installationMethod: 'C' } },
      { id: 'press', kind: 'ac-load', from: 'feed', power: 40_000, powerFactor: 0.72 },
    ]);
    const s = corrected(sized, { at: 'press', targetPowerFactor: 0.95 });
    const feed = s.upstream.find((u) => u.id === 'feed')!;
    expect(feed.sizeBefore).toBeDefined();
    expect(feed.sizeAfter).toBeDefined();
    const area = (label: string) => Number.parseFloat(label);
    expect(area(feed.sizeAfter!)).toBeLessThan(area(feed.sizeBefore!));
  });

  it('leaves the input project untouched and its corrected project solves to the same result', () => {
    const copy = JSON.parse(JSON.stringify(feeder));
    const again = corrected(copy, { at: 'washer', targetPowerFactor: 0.9 });
    expect(copy).toEqual(JSON.parse(JSON.stringify(feeder)));
    const re = solveProject(again.correctedProject);
    expect(re.ok && re.result).toEqual(again.resultAfter);
  });
});

describe('bad requests: a problem naming the element and field; nothing computed', () => {
  const lagging = project([
    { id: 'sup', kind: 'grid', phases: 3, voltage: 400, frequency: 50 },
    { id: 'mill', kind: 'ac-load', from: 'sup', power: 50_000, powerFactor: 0.8 },
    { id: 'ups', kind: 'ac-va-load', from: 'sup', apparentPower: 10_000, powerFactor: 0.9, pfSense: 'leading' },
    { id: 'heater', kind: 'network-load', from: 'sup', network: { resistor: '30 Ω' } },
    { id: 'vfd', kind: 'drive', from: 'sup', outputVoltage: 400, outputFrequency: 40, inputPowerFactor: 0.95, loss: { model: 'constant', efficiency: 0.97 } },
    { id: 'motor', kind: 'motor', from: 'vfd', ratedOutput: 15_000, loss: { model: 'constant', efficiency: 0.92 }, powerFactor: { model: 'constant', powerFactor: 0.82 } },
    { id: 'fan', kind: 'shaft-load', from: 'motor', power: 11_000 },
    { id: 'rect', kind: 'rectifier', from: 'sup', outputVoltage: 48, inputPowerFactor: 0.98, loss: { model: 'constant', efficiency: 0.95 } },
    { id: 'dc', kind: 'dc-load', from: 'rect', power: 500 },
  ]);
  const cases: [string, Parameters<typeof correctPowerFactor>[1], { code: string; elementId: string; field: string; message: RegExp }][] = [
    ['a target below the present pf', { at: 'mill', targetPowerFactor: 0.7 }, { code: 'invalid-value', elementId: 'mill', field: 'targetPowerFactor', message: /above the present power factor 0\.8000/ }],
    ['a target equal to the present pf', { at: 'mill', targetPowerFactor: 0.8 }, { code: 'invalid-value', elementId: 'mill', field: 'targetPowerFactor', message: /above the present/ }],
    ['a target of 0', { at: 'mill', targetPowerFactor: 0 }, { code: 'invalid-value', elementId: 'mill', field: 'targetPowerFactor', message: /greater than 0/ }],
    ['a negative target', { at: 'mill', targetPowerFactor: -0.9 }, { code: 'invalid-value', elementId: 'mill', field: 'targetPowerFactor', message: /greater than 0/ }],
    ['a target above 1', { at: 'mill', targetPowerFactor: 95 }, { code: 'invalid-value', elementId: 'mill', field: 'targetPowerFactor', message: /must not exceed 1/ }],
    ['a target that is not a number', { at: 'mill', targetPowerFactor: Number.NaN }, { code: 'invalid-value', elementId: 'mill', field: 'targetPowerFactor', message: /must be a number/ }],
    ['a light-load fraction of 0', { at: 'mill', targetPowerFactor: 0.95, lightLoadFraction: 0 }, { code: 'invalid-value', elementId: 'mill', field: 'lightLoadFraction', message: /between 0 and 1/ }],
    ['an unknown element id', { at: 'mil', targetPowerFactor: 0.95 }, { code: 'unknown-element', elementId: 'mil', field: 'at', message: /no element "mil"/ }],
    ['an empty element id', { at: '', targetPowerFactor: 0.95 }, { code: 'invalid-value', elementId: PROJECT_LEVEL, field: 'at', message: /must name the element/ }],
    ['an interface that is leading already', { at: 'ups', targetPowerFactor: 0.95 }, { code: 'not-correctable', elementId: 'ups', field: 'at', message: /leading already/ }],
    ['a resistive load (unity pf)', { at: 'heater', targetPowerFactor: 0.99 }, { code: 'not-correctable', elementId: 'heater', field: 'at', message: /unity power factor/ }],
    ['a DC interface', { at: 'dc', targetPowerFactor: 0.95 }, { code: 'not-correctable', elementId: 'dc', field: 'at', message: /input is DC/ }],
    ['a shaft', { at: 'fan', targetPowerFactor: 0.95 }, { code: 'not-correctable', elementId: 'fan', field: 'at', message: /mechanical shaft/ }],
    ['a drive output', { at: 'vfd', targetPowerFactor: 0.99 }, { code: 'not-correctable', elementId: 'vfd', field: 'at', message: /drive output/ }],
    ['a bad bank connection', { at: 'mill', targetPowerFactor: 0.95, connection: 'zigzag' as 'star' }, { code: 'invalid-value', elementId: 'mill', field: 'connection', message: /"star" or "delta"/ }],
  ];
  it.each(cases)('%s', (_what, request, want) => {
    const out = onSolved(correctPowerFactor, lagging, request);
    expect(out.ok).toBe(false);
    if (out.ok) return;
    expect(out.problems).toHaveLength(1);
    expect(out.problems[0]).toMatchObject({ code: want.code, elementId: want.elementId, field: want.field });
    expect(out.problems[0]!.message).toMatch(want.message);
  });

  it('a project that does not solve gives its own problems', () => {
    const out = onSolved(correctPowerFactor, project([{ id: 'sup', kind: 'grid', phases: 3, voltage: 0, frequency: 50 }]), { at: 'sup', targetPowerFactor: 0.95 });
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.problems[0]).toMatchObject({ elementId: 'sup', field: 'voltage' });
  });

  it('a motor and a rectifier are corrected at their input terminals; the motor gets the self-excitation caution', () => {
    const m = corrected(project([
      { id: 'sup', kind: 'grid', phases: 3, voltage: 400, frequency: 50 },
      { id: 'motor', kind: 'motor', from: 'sup', ratedOutput: 15_000, loss: { model: 'constant', efficiency: 0.92 }, powerFactor: { model: 'constant', powerFactor: 0.82 } },
      { id: 'fan', kind: 'shaft-load', from: 'motor', power: 11_000 },
    ]), { at: 'motor', targetPowerFactor: 0.95 });
    expect(m.side).toBe('input');
    expect(m.bankFrom).toBe('sup');
    // P in = 11 000/0.92 = 11 956.52 W; Qc = P·(tan(arccos 0.82) − tan(arccos 0.95)) = 11 956.52 × (0.698004 − 0.328684) = 4415.78 var (hand).
    expect(rel(m.bank.reactivePower, 4415.78)).toBeLessThan(1e-5);
    expect(m.warnings.join(' ')).toMatch(/self-excite/);
    const r = corrected(lagging, { at: 'rect', targetPowerFactor: 0.995 });
    expect(r.side).toBe('input');
  });
});

/**
 * Where a bank belongs (core/studies/pf/placement.ts): the rules are common practice in capacitor
 * application guides (IEEE Std 1036 on harmonic resonance) and drive and inverter makers' manuals,
 * which forbid capacitors on a drive output; no figures to check, the choice is asserted.
 */
describe('capacitor banks only where they belong', () => {
  const plant = project([
    { id: 'sup', kind: 'grid', phases: 3, voltage: 400, frequency: 50 },
    { id: 'feed', kind: 'cable', from: 'sup', length: 30, resistancePerKm: 0.524, reactancePerKm: 0.08 },
    { id: 'vfd', kind: 'drive', from: 'feed', outputVoltage: 400, outputFrequency: 45, inputPowerFactor: 0.97, loss: { model: 'constant', efficiency: 0.97 } },
    { id: 'mcable', kind: 'cable', from: 'vfd', length: 20, resistancePerKm: 1.83, reactancePerKm: 0.08 },
    { id: 'fanmotor', kind: 'motor', from: 'mcable', ratedOutput: 15_000, loss: { model: 'constant', efficiency: 0.92 }, powerFactor: { model: 'constant', powerFactor: 0.82 } },
    { id: 'fan', kind: 'shaft-load', from: 'fanmotor', power: 11_000 },
    { id: 'press', kind: 'ac-load', from: 'sup', power: 30_000, powerFactor: 0.78 },
  ]);

  it.each([
    ['the drive itself', 'vfd', /is a variable-frequency drive/],
    ['the motor the drive feeds (through its cable)', 'fanmotor', /is on the output of the drive vfd/],
    ['the cable on the drive output', 'mcable', /is on the output of the drive vfd/],
  ])('refused at %s, with the reason (PWM output; the drive supplies the motor var)', (_what, at, where) => {
    const out = onSolved(correctPowerFactor, plant, { at, targetPowerFactor: 0.95 });
    expect(out.ok).toBe(false);
    if (out.ok) return;
    expect(out.problems[0]).toMatchObject({ code: 'not-correctable', elementId: at, field: 'at' });
    expect(out.problems[0]!.message).toMatch(where);
    expect(out.problems[0]!.message).toMatch(/pulse-width modulated/);
    expect(out.problems[0]!.message).toMatch(/input power factor is set by its rectifier/);
  });

  it('at the cable that feeds the drive: computed, with the warning that the drive’s input pf is set by its rectifier (harmonic resonance)', () => {
    const out = onSolved(correctPowerFactor, plant, { at: 'feed', targetPowerFactor: 0.99 });
    if (!out.ok) throw new Error(JSON.stringify(out.problems));
    expect(out.correction.warnings.join(' ')).toMatch(/feeds the drive vfd: a drive’s input power factor is set by its rectifier .* resonate/);
  });

  it('on an inverter’s output: computed, with the warning why it is not proposed there', () => {
    const backup = project([
      { id: 'bank', kind: 'battery', voltage: 51.2, internalResistance: 0.01 },
      { id: 'inv', kind: 'inverter', from: 'bank', phases: 1, outputVoltage: 230, frequency: 50, loss: { model: 'constant', efficiency: 0.94 } },
      { id: 'run', kind: 'cable', from: 'inv', length: 15, resistancePerKm: 7.41, reactancePerKm: 0.1 },
      { id: 'compressor', kind: 'ac-load', from: 'run', power: 1500, powerFactor: 0.7 },
    ]);
    const out = onSolved(correctPowerFactor, backup, { at: 'compressor', targetPowerFactor: 0.95 });
    if (!out.ok) throw new Error(JSON.stringify(out.problems));
    expect(out.correction.warnings.join(' ')).toMatch(/on the output of the inverter inv, where this app does not propose one: the inverter supplies the reactive power from its DC side/);
    const offered = pfCorrectionCandidates(out.correction.resultBefore).filter((c) => c.offered);
    expect(offered).toEqual([]);
  });

  it('the proposals: never the drive, its cable, its motor or the inverter output; the lagging press is the one that needs a bank', () => {
    const solved = solveProject(plant);
    if (!solved.ok) throw new Error('plant does not solve');
    const list = pfCorrectionCandidates(solved.result);
    const byId = new Map(list.map((c) => [c.id, c]));
    for (const id of ['vfd', 'mcable', 'fanmotor']) {
      expect(byId.get(id)!.offered).toBe(false);
      expect(byId.get(id)!.reason).toMatch(/on the output of the drive vfd: a drive’s output is pulse-width modulated/);
    }
    expect(byId.get('press')).toMatchObject({ offered: true, needed: true, side: 'input' });
    expect(byId.get('sup')!.offered).toBe(true);
  });

  it('a project already above the default target 0.95: no place needs a bank, and asking the proposals gives no error', () => {
    const good = project([
      { id: 'sup', kind: 'grid', phases: 3, voltage: 400, frequency: 50 },
      { id: 'heater', kind: 'ac-load', from: 'sup', power: 20_000, powerFactor: 1 },
      { id: 'pump', kind: 'ac-load', from: 'sup', power: 10_000, powerFactor: 0.97 },
    ]);
    const solved = solveProject(good);
    if (!solved.ok) throw new Error('does not solve');
    const list = pfCorrectionCandidates(solved.result);
    expect(list.length).toBeGreaterThan(0);
    expect(list.some((c) => c.needed)).toBe(false);
    expect(list.find((c) => c.id === 'pump')).toMatchObject({ offered: true, needed: false, pfSense: 'lagging' });
  });
});
