/**
 * Conductor sizing through the chain solve: which size is chosen and why, the ampacity chain,
 * protection, the feedback of the conductor's drop into the current, whole-path drops, and refusals
 * of bad input. Every check value names its source beside it.
 */
import { describe, expect, it } from 'vitest';
import { CONDUCTOR_CAUTION, solveProject, type ElementResult, type Problem, type SolveResult } from '../../core/index.ts';

const project = (elements: unknown[], extra: Record<string, unknown> = {}) => ({ format: 'joulepath-project', version: 2, name: 'conductor case', elements, ...extra });

function solved(elements: unknown[], extra: Record<string, unknown> = {}): SolveResult {
  const out = solveProject(project(elements, extra));
  if (!out.ok) throw new Error(JSON.stringify(out.problems));
  return out.result;
}
function refused(elements: unknown[]): Problem[] {
  const out = solveProject(project(elements));
  if (out.ok) throw new Error('expected a refusal');
  return out.problems;
}
const el = (r: SolveResult, id: string): ElementResult => r.elements.find((e) => e.id === id)!;

const FT = 0.3048; // m per ft (exact, by definition)
const PER_KFT = 1 / (1000 * FT); // Ω/kft → Ω/m

describe('NEC ampacity chain', () => {
  it('4 × 10 AWG THHN at 120 °F: 40 A × 0.82 × 0.80 = 26.24 A (Table 310.16 90 °C column, Table 310.15(B)(1)(1) 114–122 °F row, Table 310.15(C)(1) 4–6 conductors)', () => {
    // Published example (stallcupeducation "applying correction factors"): 40 A × 0.82 = 32.8 A;
    // with all four conductors current-carrying, × 0.80 (Table 310.15(C)(1)) = 26.24 A.
    const r = solved([
      { id: 'src', kind: 'grid', phases: 1, voltage: 240, frequency: 60 },
      {
        id: 'run',
        kind: 'cable',
        from: 'src',
        length: 10,
        conductor: { system: 'nec', material: 'copper', size: '10 AWG', insulationRating: 90, terminationRating: 90, ambient: (120 - 32) / 1.8, currentCarryingConductors: 4 },
      },
      { id: 'ld', kind: 'ac-load', from: 'run', power: 2000, powerFactor: 1 },
    ]);
    const c = el(r, 'run').conductor!;
    expect(c.ampacity.table).toBe(40); // NEC Table 310.16, 10 AWG Cu 90 °C
    expect(c.ampacity.ambientFactor).toBe(0.82); // Table 310.15(B)(1)(1), 46–50 °C (114–122 °F), 90 °C
    expect(c.ampacity.groupingFactor).toBe(0.8); // Table 310.15(C)(1), 4–6 conductors
    expect(c.ampacity.corrected).toBeCloseTo(26.24, 10); // 40 × 0.82 × 0.80 (hand)
    expect(c.ampacity.terminationLimit).toBe(40); // 90 °C terminations given
    expect(c.ampacity.perSet).toBeCloseTo(26.24, 10);
    expect(c.governing).toBe('fixed');
    // ≈ 8.4 A load current (2000 W/≈ 239.9 V): the smallest NEC 2023 240.6(A) rating ≥ 8.4 A is 10 A.
    expect(c.device.rating).toBe(10);
  });

  it('termination column limits a 90 °C conductor: 3/0 AWG 225 A corrected; 165 A on a 100 A circuit (110.14(C)(1)(a)), 200 A with 75 °C terminations (Table 310.16)', () => {
    // 5000 W / 51.2 V = 97.7 A: the circuit is 100 A (240.6(A)), 100 A or less, so NEC 110.14(C)(1)(a)
    // takes the 60 °C column unless the terminations are marked 75 °C.
    const run = (terminationRating?: number) =>
      el(
        solved([
          { id: 'src', kind: 'battery', voltage: 51.2 },
          { id: 'run', kind: 'cable', from: 'src', length: 2, conductor: { system: 'nec', material: 'copper', size: '3/0 AWG', insulationRating: 90, ...(terminationRating ? { terminationRating } : {}) } },
          { id: 'ld', kind: 'dc-load', from: 'run', power: 5000 },
        ]),
        'run',
      ).conductor!;
    const c = run();
    expect(c.ampacity.corrected).toBe(225); // Table 310.16 3/0 Cu 90 °C
    expect(c.ampacity.terminationLimit).toBe(165); // Table 310.16 3/0 Cu 60 °C
    expect(c.ampacity.terminationColumn?.rating).toBe(60);
    expect(c.ampacity.terminationColumn?.rule).toMatch(/110\.14\(C\)\(1\)\(a\)/);
    expect(c.ampacity.perSet).toBe(165);
    const m = run(75);
    expect(m.ampacity.terminationLimit).toBe(200); // Table 310.16 3/0 Cu 75 °C
    expect(m.ampacity.perSet).toBe(200);
  });
});

describe('size choice', () => {
  it('ampacity governs: 3φ 480 V, 45 kW at pf 1, 10 m, THWN 75 °C → 6 AWG (55 A at 60 °C), 8 AWG (40 A) too small (Table 310.16)', () => {
    // Hand: design current at nominal voltage 45 000/(√3 × 480) = 54.1 A (NEC 220.5(A)); the
    // operating current is ≈ 0.3 % higher (the drop). A 60 A circuit: 110.14(C)(1)(a) 60 °C column.
    // Table 310.16 Cu 60 °C: 8 AWG 40 A < 54.1 A; 6 AWG 55 A ≥ 54.1 A. Device: 240.6(A) smallest
    // ≥ 54.1 A is 60 A > 55 A; 55 A is not a standard rating and 60 A is the next above: 240.4(B).
    // Drop on 6 AWG ≈ √3 × 54.1 A × 10 m × 0.49 Ω/kft / 304.8 m/kft ≈ 1.5 V = 0.31 % (Table 9 R, PVC).
    const r = solved([
      { id: 'src', kind: 'grid', phases: 3, voltage: 480, frequency: 60 },
      { id: 'run', kind: 'cable', from: 'src', length: 10, conductor: { system: 'nec', material: 'copper', size: 'auto', insulationRating: 75 } },
      { id: 'ld', kind: 'ac-load', from: 'run', power: 45000, powerFactor: 1 },
    ]);
    const c = el(r, 'run').conductor!;
    expect(c.current / (45000 / (Math.sqrt(3) * 480))).toBeGreaterThan(1.002);
    expect(c.current / (45000 / (Math.sqrt(3) * 480))).toBeLessThan(1.004);
    expect(c.designCurrent).toBeCloseTo(45000 / (Math.sqrt(3) * 480), 9); // NEC 220.5(A), hand
    expect(c.designBasis.basis).toBe('load-nominal');
    expect(c.size).toBe('6 AWG');
    expect(c.governing).toBe('ampacity');
    expect(c.ampacity.total).toBe(55); // Table 310.16 6 AWG Cu 60 °C
    expect(c.device.rating).toBe(60);
    expect(c.device.rule).toBe('NEC 240.4(B)');
    expect(c.drop.exactPercent).toBeGreaterThan(0.25);
    expect(c.drop.exactPercent).toBeLessThan(0.35);
    expect(c.caution).toBe(CONDUCTOR_CAUTION);
  });

  it('voltage drop governs: 48 V DC, 30 m, 1 kW → 4 AWG; 6 AWG drops more than 3 % (Table 8 stranded Cu)', () => {
    // Hand: I ≈ 1000/47 ≈ 21 A. Ampacity alone: 12 AWG (25 A at 75 °C) would do, but 240.4(D) caps
    // its device at 20 A; 10 AWG passes ampacity and protection (25 A device ≤ 30 A).
    // Drop, 6 AWG: Table 8 0.491 Ω/kft at 75 °C; even at the coldest it can run (30 °C ambient),
    // R = 0.491 × (1 + 0.00323 × (30 − 75)) = 0.4196 Ω/kft = 1.3768 Ω/km (Table 8 Note 2), loop
    // 60 m → 0.0826 Ω, drop ≥ 0.0826 × 20.8 A = 1.72 V = 3.6 % > 3 %.
    // 4 AWG: 0.308 Ω/kft at 75 °C = 1.0105 Ω/km, loop 0.0606 Ω, drop ≤ 0.0606 × 21.3 = 1.29 V = 2.7 %.
    const r = solved([
      { id: 'src', kind: 'battery', voltage: 48 },
      { id: 'run', kind: 'cable', from: 'src', length: 30, conductor: { system: 'nec', material: 'copper', size: 'auto', insulationRating: 75 } },
      { id: 'ld', kind: 'dc-load', from: 'run', power: 1000 },
    ]);
    const c = el(r, 'run').conductor!;
    expect(c.size).toBe('4 AWG');
    expect(c.governing).toBe('voltage-drop');
    expect(c.drop.exactPercent).toBeLessThanOrEqual(3);
    expect(c.drop.exactPercent).toBeGreaterThan(2.0);
    const at30 = 0.491 * (1 + 0.00323 * (30 - 75)) * PER_KFT; // Ω/m, 6 AWG at 30 °C
    expect((2 * 30 * at30 * 20.8 * 100) / 48).toBeGreaterThan(3);
  });

  it('protection governs: 12 AWG carries 21 A (25 A at 75 °C) but 240.4(D) caps its device at 20 A → 10 AWG', () => {
    // 240 V 1φ, 5 kW at pf 1, 3 m: I ≈ 20.8 A. Table 310.16 Cu 75 °C: 14 AWG 20 A < 20.8 A;
    // 12 AWG 25 A ≥ 20.8 A, but the smallest 240.6(A) rating ≥ 20.8 A is 25 A > 20 A (240.4(D), from memory).
    const r = solved([
      { id: 'src', kind: 'grid', phases: 1, voltage: 240, frequency: 60 },
      { id: 'run', kind: 'cable', from: 'src', length: 3, conductor: { system: 'nec', material: 'copper', size: 'auto', insulationRating: 75, terminationRating: 75 } },
      { id: 'ld', kind: 'ac-load', from: 'run', power: 5000, powerFactor: 1 },
    ]);
    const c = el(r, 'run').conductor!;
    expect(c.size).toBe('10 AWG');
    expect(c.governing).toBe('protection');
    expect(c.device.rating).toBe(25);
  });

  it('continuous load: 125 % checked against the termination column (NEC 210.19(A)(1)), 2/0 fails at 160 A, 3/0 holds', () => {
    // 12.8 V, 2 kW, 3 m, THHN 90 °C, 75 °C terminations: I ≈ 159 A, × 1.25 ≈ 199 A. Table 310.16
    // Cu 75 °C: 2/0 175 A < 199 A; 3/0 200 A ≥ 199 A. Device: smallest 240.6(A) ≥ 199 A = 200 A.
    const r = solved([
      { id: 'src', kind: 'battery', voltage: 12.8 },
      { id: 'run', kind: 'cable', from: 'src', length: 3, conductor: { system: 'nec', material: 'copper', size: 'auto', insulationRating: 90, continuous: true } },
      { id: 'ld', kind: 'dc-load', from: 'run', power: 2000 },
    ]);
    const c = el(r, 'run').conductor!;
    expect(c.designCurrent).toBeCloseTo(1.25 * (2000 / 12.8), 9); // NEC 210.19(A)(1)(a) at the nominal voltage (220.5(A)), hand
    expect(c.operatingCurrent).toBeGreaterThan(2000 / 12.8);
    expect(c.size).toBe('3/0 AWG');
    expect(c.governing).toBe('ampacity');
    expect(c.device.rating).toBe(200);
  });

  it('NEC 240.4(B): 6 AWG (65 A) protected at 70 A when the load is 61 A', () => {
    // 480 V 3φ, 50.7 kW: I ≈ 61 A. 6 AWG 65 A (Table 310.16 75 °C) ≥ 61 A; the smallest 240.6(A)
    // rating ≥ 61 A is 70 A; 65 A is not a standard rating, so the next higher (70 A ≤ 800 A) may protect it.
    const r = solved([
      { id: 'src', kind: 'grid', phases: 3, voltage: 480, frequency: 60 },
      { id: 'run', kind: 'cable', from: 'src', length: 5, conductor: { system: 'nec', material: 'copper', size: 'auto', insulationRating: 75, terminationRating: 75 } },
      { id: 'ld', kind: 'ac-load', from: 'run', power: 50700, powerFactor: 1 },
    ]);
    const c = el(r, 'run').conductor!;
    expect(c.size).toBe('6 AWG');
    expect(c.device.rating).toBe(70);
    expect(c.device.note).toMatch(/240\.4\(B\)/);
  });

  it('IEC: 400 V 3φ, 30 kW at pf 0.85, 120 m, XLPE method C → 25 mm² (drop governs); 16 mm² drops more than 3 %', () => {
    // Hand: I ≈ 30 000/(√3 × 400 × 0.85) = 50.9 A. Capacity XLPE C 3 loaded (IEC 60364-5-52 B.52.5):
    // 10 mm² 71 A ≥ 51 A, so ampacity allows 10 mm². Drop on 16 mm² (IEC 60228 1.15 Ω/km at 20 °C,
    // at ≥ 30 °C × 1.04; λ = 0.08 mΩ/m, Annex G): √3 × 51 × 120 × (1.196e-3 × 0.85 + 0.08e-3 × 0.527)
    // = 11.1 V = 2.8 % at 30 °C and more as it warms: the engine finds 3.10 %. 25 mm² (0.727 Ω/km) ≈ 1.9 %.
    const r = solved([
      { id: 'g', kind: 'grid', phases: 3, voltage: 400, frequency: 50 },
      { id: 'cab', kind: 'cable', from: 'g', length: 120, conductor: { system: 'iec', material: 'copper', size: 'auto', insulation: 'xlpe', installationMethod: 'C' } },
      { id: 'ld', kind: 'ac-load', from: 'cab', power: 30000, powerFactor: 0.85 },
    ]);
    const c = el(r, 'cab').conductor!;
    expect(c.size).toBe('25 mm²');
    expect(c.governing).toBe('voltage-drop');
    expect(c.ampacity.table).toBe(119); // B.52.5 XLPE C 3 loaded, 25 mm² (corroborated)
    expect(c.device.rating).toBe(63); // IEC 60898-1: smallest preferred ≥ 51.9 A
    expect(c.drop.exactPercent).toBeGreaterThan(1.8);
    expect(c.drop.exactPercent).toBeLessThan(2.0);
  });

  it('IEC above 125 A: no IEC 60898-1 rating; the note says so and no rating is shown', () => {
    const r = solved([
      { id: 'g', kind: 'grid', phases: 3, voltage: 400, frequency: 50 },
      { id: 'cab', kind: 'cable', from: 'g', length: 20, conductor: { system: 'iec', material: 'copper', size: 'auto', insulation: 'xlpe', installationMethod: 'E' } },
      { id: 'ld', kind: 'ac-load', from: 'cab', power: 120000, powerFactor: 0.9 },
    ]);
    const c = el(r, 'cab').conductor!;
    expect(c.current).toBeGreaterThan(125);
    expect(c.device.rating).toBeUndefined();
    expect(c.device.note).toMatch(/IEC 60947-2/);
  });
});

describe('feedback into the chain solve', () => {
  const chain = (length: number) => [
    { id: 'src', kind: 'battery', voltage: 12 },
    { id: 'run', kind: 'cable', from: 'src', length, conductor: { system: 'nec', material: 'copper', size: 'auto', insulationRating: 75, maxDropPercent: 5 } },
    { id: 'ld', kind: 'dc-load', from: 'run', power: 600 },
  ];

  it('the current is the one of the chosen conductor, not the ideal 600/12 = 50 A (constant-power load, Ohm)', () => {
    const r = solved(chain(6));
    const run = el(r, 'run');
    const c = run.conductor!;
    expect(c.current).toBeGreaterThan(50);
    // Self-consistent: the sizing's current is the solve's current; the drop is the solve's.
    expect(c.current).toBeCloseTo(run.input!.current, 12);
    expect(c.drop.exactVolts).toBeCloseTo(run.input!.voltage - run.output!.voltage, 12);
    // Loss = I²·R_loop with the reported R at temperature (Joule), and it is the element's loss.
    expect(run.loss).toBeCloseTo(c.current ** 2 * ((2 * 6 * c.resistance.perKm) / 1000), 9);
    expect(c.loss).toBe(run.loss);
    // R at temperature from the stated method: R_T = R_75·(1 + α(T − 75)), α = 0.00323 (Table 8 Note 2).
    expect(c.resistance.perKm).toBeCloseTo(c.resistance.referencePerKm * (1 + 0.00323 * (c.resistance.operatingTemperature - 75)), 9);
    // T = T_a + (T_max − T_a)·(I/I_z)² (common practice), T_max = 75 °C here.
    expect(c.resistance.operatingTemperature).toBeCloseTo(30 + 45 * (c.current / c.ampacity.corrected) ** 2, 6);
    // DC: the approximation I·R_loop equals the exact drop (no reactance, no angle).
    expect(c.drop.approxVolts).toBeCloseTo(c.drop.exactVolts, 9);
    // Energy balance still closes with the conductor's loss as its own stage.
    expect(r.totals.balanceError).toBeLessThan(1e-9);
  });

  it('two sized links in series: the downstream drop raises the upstream current; both self-consistent', () => {
    const r = solved([
      { id: 'src', kind: 'battery', voltage: 24 },
      { id: 'main', kind: 'cable', from: 'src', length: 4, conductor: { system: 'nec', material: 'copper', size: 'auto', insulationRating: 90, continuous: true } },
      { id: 'bus', kind: 'dc-bus', from: 'main', fixedLoss: 0 },
      { id: 'branch', kind: 'cable', from: 'bus', length: 20, conductor: { system: 'iec', material: 'copper', size: 'auto', insulation: 'xlpe', installationMethod: 'C' } },
      { id: 'ld', kind: 'dc-load', from: 'branch', power: 800 },
    ]);
    for (const id of ['main', 'branch']) {
      const e = el(r, id);
      const c = e.conductor!;
      expect(c.current).toBeCloseTo(e.input!.current, 12);
      expect(c.drop.checkPercent).toBeLessThanOrEqual(3 + 1e-9);
      expect(e.loss).toBeCloseTo(c.current ** 2 * ((2 * (id === 'main' ? 4 : 20) * c.resistance.perKm) / 1000), 9);
    }
    // Σ drops on the path = the two links' own (default NEC informational limits: 3 % / 5 %).
    const path = r.voltageDrop![0]!;
    expect(path.links.map((l) => l.id)).toEqual(['main', 'branch']);
    // Sized links count with their drop check by the method (% of nominal).
    expect(path.totalPercent).toBeCloseTo(el(r, 'main').conductor!.drop.checkPercent + el(r, 'branch').conductor!.drop.checkPercent, 12);
    // The main link carries the branch's loss too: P_main,out = 800 W + branch loss (energy balance).
    expect(el(r, 'main').pOut).toBeCloseTo(800 + el(r, 'branch').loss, 9);
  });

  it('the working shows every step in words with units', () => {
    const c = el(solved(chain(6)), 'run').conductor!;
    const labels = c.steps.map((s) => s.label);
    for (const l of ['Design current', 'Operating current', 'Table ampacity', 'Ambient factor', 'Corrected ampacity', 'Termination column', 'Protective device', 'Voltage drop, check', 'Conductor temperature (estimate)', 'Resistance at that temperature', 'Voltage drop, solved chain', 'Voltage drop, approximate', 'Loss', 'Size']) {
      expect(labels).toContain(l);
    }
    for (const s of c.steps) expect(s.note.length).toBeGreaterThan(0);
  });
});

describe('whole-path voltage drop', () => {
  it('sums the links from the source and resets at a regulating converter; flags against the limits', () => {
    const r = solved([
      { id: 'src', kind: 'battery', voltage: 48 },
      { id: 'feed', kind: 'cable', from: 'src', length: 10, resistancePerKm: 3.08 },
      { id: 'bus', kind: 'dc-bus', from: 'feed', fixedLoss: 0 },
      { id: 'branch', kind: 'cable', from: 'bus', length: 15, resistancePerKm: 3.08 },
      { id: 'lamp', kind: 'dc-load', from: 'branch', power: 300 },
      { id: 'conv', kind: 'dc-dc', from: 'bus', outputVoltage: 24, loss: { model: 'constant', efficiency: 0.95 } },
      { id: 'tail', kind: 'cable', from: 'conv', length: 5, resistancePerKm: 3.08 },
      { id: 'radio', kind: 'dc-load', from: 'tail', power: 50 },
    ]);
    const paths = r.voltageDrop!;
    const lamp = paths.find((p) => p.loadId === 'lamp')!;
    const pct = (id: string) => {
      const e = el(r, id);
      return (100 * (e.input!.voltage - e.output!.voltage)) / e.input!.voltage;
    };
    expect(lamp.startId).toBe('src');
    expect(lamp.links.map((l) => l.id)).toEqual(['feed', 'branch']);
    expect(lamp.totalPercent).toBeCloseTo(pct('feed') + pct('branch'), 12);
    const radio = paths.find((p) => p.loadId === 'radio')!;
    expect(radio.startId).toBe('conv'); // the DC-DC converter holds 24 V: the path starts afresh there
    expect(radio.links.map((l) => l.id)).toEqual(['tail']);
    // The converter's own input is a path end too: the feed drop it sees (bus passes it through).
    const convIn = paths.find((p) => p.loadId === 'conv')!;
    expect(convIn.startId).toBe('src');
    expect(convIn.links.map((l) => l.id)).toEqual(['feed']);
    expect(convIn.totalPercent).toBeCloseTo(pct('feed'), 12);
    // Defaults: 3 % per link, 5 % total (NEC 210.19(A) IN No. 3, informational).
    expect(lamp.perLinkLimitPercent).toBe(3);
    expect(lamp.totalLimitPercent).toBe(5);
    expect(lamp.exceedsLimit).toBe(lamp.totalPercent > 5 || lamp.links.some((l) => l.dropPercent > 3));
  });

  it('IEC Annex G basis: type A, other uses → 5 % total, no per-link limit (Table G.52.1)', () => {
    const r = solved(
      [
        { id: 'g', kind: 'grid', phases: 1, voltage: 230, frequency: 50 },
        { id: 'c1', kind: 'cable', from: 'g', length: 40, resistancePerKm: 7.41 },
        { id: 'ld', kind: 'ac-load', from: 'c1', power: 3000, powerFactor: 1 },
      ],
      { dropLimits: { basis: 'iec-a-other' } },
    );
    const p = r.voltageDrop![0]!;
    expect(p.totalLimitPercent).toBe(5);
    expect(p.perLinkLimitPercent).toBeUndefined();
    expect(p.limitBasis).toMatch(/Annex G/);
    // Hand: R_loop = 2 × 40 × 7.41/1000 = 0.593 Ω, I ≈ 13.9 A, drop ≈ 8.2 V = 3.6 % < 5 %.
    expect(p.totalPercent).toBeGreaterThan(3.4);
    expect(p.totalPercent).toBeLessThan(3.8);
    expect(p.exceedsLimit).toBe(false);
  });
});

describe('bad input: a clear problem naming element and field, no size shown', () => {
  const nec = { system: 'nec', material: 'copper', size: 'auto', insulationRating: 75 };
  const wrap = (cable: Record<string, unknown>, power = 1000) => [
    { id: 'src', kind: 'battery', voltage: 48 },
    { id: 'run', kind: 'cable', from: 'src', length: 10, ...cable },
    { id: 'ld', kind: 'dc-load', from: 'run', power },
  ];

  it('a conductor field out of range names the field path', () => {
    const p = refused(wrap({ conductor: { ...nec, insulationRating: 80 } }));
    expect(p).toEqual([expect.objectContaining({ code: 'invalid-value', elementId: 'run', field: 'conductor.insulationRating', message: 'must be 60, 75 or 90 (°C)' })]);
    const q = refused(wrap({ conductor: { ...nec, system: 'bs' } }));
    expect(q).toEqual([expect.objectContaining({ elementId: 'run', field: 'conductor.system' })]);
  });

  it('zero length', () => {
    const p = refused(wrap({ conductor: nec, length: 0 }));
    expect(p).toContainEqual(expect.objectContaining({ elementId: 'run', field: 'length', message: 'must be greater than 0 m' }));
  });

  it('current above the largest listed size × parallel sets: 500 kcmil carries 380 A at 75 °C (Table 310.16)', () => {
    const p = refused(wrap({ conductor: nec, length: 2 }, 48 * 500));
    expect(p).toHaveLength(1);
    expect(p[0]).toMatchObject({ code: 'no-size-fits', elementId: 'run', field: 'parallelSets' });
    expect(p[0]!.message).toMatch(/500 kcmil/);
    expect(p[0]!.message).toMatch(/380\.0 A/);
  });

  it('two parallel sets of 500 kcmil carry it (2 × 380 = 760 A ≥ ≈ 505 A)', () => {
    const r = solved(wrap({ conductor: nec, length: 2, parallelSets: 2 }, 48 * 500));
    expect(el(r, 'run').conductor!.parallelSets).toBe(2);
  });

  it('ambient beyond the correction table: 75 °C conductors end at 70 °C (Table 310.15(B)(1)(1))', () => {
    const p = refused(wrap({ conductor: { ...nec, ambient: 72 } }));
    expect(p).toEqual([expect.objectContaining({ code: 'outside-table', elementId: 'run', field: 'conductor.ambient', value: 72 })]);
    expect(p[0]!.message).toMatch(/70 °C/);
  });

  it('IEC PVC ambient beyond 60 °C (Table B.52.14)', () => {
    const p = refused(wrap({ conductor: { system: 'iec', material: 'copper', size: 'auto', insulation: 'pvc', installationMethod: 'C', ambient: 65 } }));
    expect(p).toEqual([expect.objectContaining({ code: 'outside-table', field: 'conductor.ambient' })]);
  });

  it('an installation method without published capacities in the tables (A1), and one that does not exist (Z9)', () => {
    const a1 = refused(wrap({ conductor: { system: 'iec', material: 'copper', size: 'auto', insulation: 'pvc', installationMethod: 'A1' } }));
    expect(a1).toEqual([expect.objectContaining({ code: 'outside-table', elementId: 'run', field: 'conductor.installationMethod', value: 'A1' })]);
    expect(a1[0]!.message).toMatch(/B1, B2, C, E/);
    const z9 = refused(wrap({ conductor: { system: 'iec', material: 'copper', size: 'auto', insulation: 'pvc', installationMethod: 'Z9' } }));
    expect(z9).toEqual([expect.objectContaining({ code: 'invalid-value', elementId: 'run', field: 'conductor.installationMethod' })]);
  });

  it('an unknown size label lists the table sizes', () => {
    const p = refused(wrap({ conductor: { ...nec, size: '7 AWG' } }));
    expect(p).toEqual([expect.objectContaining({ elementId: 'run', field: 'conductor.size', value: '7 AWG' })]);
    expect(p[0]!.message).toMatch(/1\/0 AWG/);
  });

  it('both an explicit impedance and a conductor, or neither', () => {
    expect(refused(wrap({ conductor: nec, resistancePerKm: 1 }))).toEqual([expect.objectContaining({ elementId: 'run', field: 'resistancePerKm' })]);
    expect(refused(wrap({}))).toEqual([expect.objectContaining({ elementId: 'run', field: 'resistancePerKm', message: expect.stringMatching(/required/) })]);
  });

  it('a drop limit no size can meet names maxDropPercent', () => {
    const p = refused(wrap({ conductor: { ...nec, maxDropPercent: 0.01 }, length: 100 }, 2000));
    expect(p).toEqual([expect.objectContaining({ code: 'no-size-fits', elementId: 'run', field: 'conductor.maxDropPercent' })]);
  });

  it('a fixed size that is overloaded solves but warns (conductor-check), never silently', () => {
    const r = solved(wrap({ conductor: { ...nec, size: '14 AWG' } }, 1500));
    expect(r.warnings).toContainEqual(expect.objectContaining({ code: 'conductor-check', elementId: 'run' }));
  });
});
