/**
 * The design current a cable is sized for, by the basis that fits its circuit (core/conductors/
 * design-current.ts), and the device and coordination rules that follow from it. Every check value
 * names its source beside it.
 */
import { describe, expect, it } from 'vitest';
import { solveProject, type ConductorResult, type Problem } from '../../core/index.ts';

const project = (elements: unknown[]) => ({ format: 'joulepath-project', version: 2, name: 'design basis case', elements });
function cond(elements: unknown[], id = 'run'): ConductorResult {
  const out = solveProject(project(elements));
  if (!out.ok) throw new Error(JSON.stringify(out.problems));
  return out.result.elements.find((e) => e.id === id)!.conductor!;
}
function refused(elements: unknown[]): Problem[] {
  const out = solveProject(project(elements));
  if (out.ok) throw new Error('expected a refusal');
  return out.problems;
}
const HP = 745.7; // W per hp (NEMA MG 1 definition, 550 ft·lbf/s)
const nec = (extra: Record<string, unknown> = {}) => ({ system: 'nec', material: 'copper', size: 'auto', insulationRating: 75, ...extra });
const grid480 = { id: 'src', kind: 'grid', phases: 3, voltage: 480, frequency: 60 };
const motor = (id: string, from: string, hp: number) => [
  { id, kind: 'motor', from, ratedOutput: hp * HP, ratedVoltage: 460, efficiencyClass: 'NEMA-premium', poles: 4, ratedFrequency: 60 },
  { id: `${id}-shaft`, kind: 'shaft-load', from: id, power: 0.6 * hp * HP },
];

describe('motor branch circuit (NEC 430.22, 430.6(A)(1), Table 430.52(C)(1))', () => {
  const branch = (conductor: Record<string, unknown>) => cond([grid480, { id: 'run', kind: 'cable', from: 'src', length: 15, conductor: nec(conductor) }, ...motor('m', 'run', 25)]);

  it('25 hp at 460 V: 125 % of the Table 430.250 full-load current, never the operating current', () => {
    const c = branch({});
    expect(c.designBasis.basis).toBe('motor-branch');
    expect(c.designBasis.baseCurrent).toBe(34); // NEC Table 430.250, 25 hp, 460 V
    expect(c.designCurrent).toBeCloseTo(42.5, 12); // 1.25 × 34 A (NEC 430.22)
    expect(c.operatingCurrent).toBeLessThan(34); // the motor runs at 60 % load: not the sizing basis
    expect(c.designBasis.rule).toMatch(/430\.22/);
  });

  it('60 °C column for a circuit of 100 A or less: 8 AWG (40 A) fails 42.5 A, 6 AWG (55 A); 8 AWG (50 A) with 75 °C terminations', () => {
    const c = branch({});
    expect(c.size).toBe('6 AWG'); // Table 310.16 Cu 60 °C: 8 AWG 40 A < 42.5 A ≤ 6 AWG 55 A
    expect(c.governing).toBe('ampacity');
    expect(c.ampacity.terminationColumn?.rating).toBe(60); // NEC 110.14(C)(1)(a)
    const m = branch({ terminationRating: 75 });
    expect(m.size).toBe('8 AWG'); // Table 310.16 Cu 75 °C: 8 AWG 50 A ≥ 42.5 A
  });

  it('device: inverse time breaker 250 % × 34 A = 85 A → 90 A (Exception No. 1); time-delay fuse 175 % → 59.5 A → 60 A', () => {
    const c = branch({});
    expect(c.device.rating).toBe(90); // NEC Table 430.52(C)(1) 250 % (from memory); next higher 240.6(A) rating
    expect(c.device.rule).toBe('NEC Table 430.52(C)(1)');
    expect(branch({ motorDevice: 'time-delay-fuse' }).device.rating).toBe(60); // 175 % × 34 = 59.5 A → 60 A (from memory)
    expect(branch({ motorDevice: 'non-time-delay-fuse' }).device.rating).toBe(110); // 300 % × 34 = 102 A → 110 A (from memory)
  });

  it('the basis can be overridden: "load" sizes for the motor at its operating point at nominal voltage', () => {
    const c = branch({ designCurrentBasis: 'load' });
    expect(c.designBasis.basis).toBe('load-nominal');
    expect(c.designCurrent).toBeLessThan(34);
  });
});

describe('feeder to several motors (NEC 430.24, 430.62(A))', () => {
  it('25 hp + 10 hp at 460 V: 1.25 × 34 + 14 = 56.5 A; device ≤ 90 A + 14 A = 104 A → 100 A', () => {
    const c = cond([grid480, { id: 'run', kind: 'cable', from: 'src', length: 15, conductor: nec() }, ...motor('big', 'run', 25), ...motor('small', 'run', 10)]);
    expect(c.designBasis.basis).toBe('motor-feeder');
    expect(c.designCurrent).toBeCloseTo(1.25 * 34 + 14, 12); // Table 430.250: 34 A (25 hp), 14 A (10 hp), 460 V
    expect(c.device.rating).toBe(100); // 430.62(A): largest standard rating ≤ 90 + 14 A (240.6(A))
    expect(c.device.rule).toBe('NEC 430.62(A)');
    // 60 °C column (a 60 A circuit): 4 AWG 70 A ≥ 56.5 A > 6 AWG 55 A (Table 310.16)
    expect(c.size).toBe('4 AWG');
  });
});

describe('inverter input at its low-voltage cut-off (NEC 690.8(A)/(B), 706.30)', () => {
  const chain = (inverter: Record<string, unknown>, conductor: Record<string, unknown> = {}) => [
    { id: 'src', kind: 'battery', voltage: 51.2 },
    { id: 'run', kind: 'cable', from: 'src', length: 2, conductor: nec({ insulationRating: 90, ...conductor }) },
    { id: 'inv', kind: 'inverter', from: 'run', phases: 1, outputVoltage: 120, frequency: 60, ...inverter },
    { id: 'ld', kind: 'ac-load', from: 'inv', power: 800, powerFactor: 1 },
  ];

  it('3 kW at 92 % from a 42 V cut-off: 3000 / (0.92 × 42) = 77.6 A × 1.25 = 97.0 A, not today’s 800 W load', () => {
    const c = cond(chain({ loss: { model: 'constant', efficiency: 0.92, ratedPower: 3000 }, lowVoltageCutoff: 42 }));
    expect(c.designBasis.basis).toBe('inverter-input');
    expect(c.designBasis.baseCurrent).toBeCloseTo(3000 / (0.92 * 42), 9); // hand
    expect(c.designCurrent).toBeCloseTo((1.25 * 3000) / (0.92 * 42), 9); // × 1.25 (690.8(B)(1))
    expect(c.device.rating).toBe(100); // smallest 240.6(A) rating ≥ 97.0 A
    // A 100 A circuit → the 60 °C column (110.14(C)(1)(a)): 2 AWG 95 A < 97.0 A ≤ 1 AWG 110 A.
    expect(c.size).toBe('1 AWG'); // Table 310.16 Cu 60 °C: 2 AWG 95 A, 1 AWG 110 A
  });

  it('without a cut-off the automatic basis falls back to the load and says which rating to enter; "equipment" refuses', () => {
    const c = cond(chain({ loss: { model: 'constant', efficiency: 0.92, ratedPower: 3000 } }));
    expect(c.designBasis.basis).toBe('load-nominal');
    expect(c.designBasis.fallback).toMatch(/low-voltage cut-off/);
    const p = refused(chain({ loss: { model: 'constant', efficiency: 0.92, ratedPower: 3000 } }, { designCurrentBasis: 'equipment' }));
    expect(p).toEqual([expect.objectContaining({ elementId: 'run', field: 'conductor.designCurrentBasis' })]);
    expect(p[0]!.message).toMatch(/low-voltage cut-off/);
  });
});

describe('a design current the user enters', () => {
  const chain = (conductor: Record<string, unknown>) => [
    { id: 'src', kind: 'battery', voltage: 24 },
    { id: 'run', kind: 'cable', from: 'src', length: 2, conductor: nec(conductor) },
    { id: 'ld', kind: 'dc-load', from: 'run', power: 240 },
  ];
  it('is used as given (× 1.25 when continuous) and named', () => {
    const c = cond(chain({ designCurrentBasis: 'given', designCurrent: 40, continuous: true }));
    expect(c.designBasis.basis).toBe('given');
    expect(c.designCurrent).toBe(50); // 40 A × 1.25 (NEC 210.19(A)(1)(a))
  });
  it('is refused without the basis "given", and the basis "given" without a current', () => {
    expect(refused(chain({ designCurrent: 40 }))).toEqual([expect.objectContaining({ elementId: 'run', field: 'conductor.designCurrent' })]);
    expect(refused(chain({ designCurrentBasis: 'given' }))).toEqual([expect.objectContaining({ elementId: 'run', field: 'conductor.designCurrent' })]);
  });
});

describe('IEC 60364-4-43 433.1 coordination: circuit-breaker against gG fuse', () => {
  // 400 V 3φ, I_B = 38 A; PVC method C, 3 loaded (IEC 60364-5-52 Table B.52.4): 4 mm² 32 A, 6 mm² 41 A, 10 mm² 57 A.
  const power = Math.sqrt(3) * 400 * 38 * 0.9;
  const chain = (deviceType?: string) => [
    { id: 'src', kind: 'grid', phases: 3, voltage: 400, frequency: 50 },
    { id: 'run', kind: 'cable', from: 'src', length: 5, conductor: { system: 'iec', material: 'copper', size: 'auto', insulation: 'pvc', installationMethod: 'C', ...(deviceType ? { deviceType } : {}) } },
    { id: 'ld', kind: 'ac-load', from: 'run', power, powerFactor: 0.9 },
  ];
  it('circuit-breaker (I₂ = 1.45 I_n): 6 mm² with 40 A, I₂ = 58 A ≤ 1.45 × 41 = 59.45 A', () => {
    const c = cond(chain());
    expect(c.designCurrent).toBeCloseTo(38, 9); // hand: P / (√3·U·cosφ)
    expect(c.size).toBe('6 mm²');
    expect(c.device.rating).toBe(40); // IEC 60898-1 preferred rating ≥ 38 A
    expect(c.device.coordination).toMatchObject({ in: 40, iz: 41, ok: true });
    expect(c.device.coordination!.i2).toBeCloseTo(58, 9); // 1.45 × 40 (IEC 60898-1, from memory)
  });
  it('gG fuse (I₂ = 1.6 I_n): 40 A on 6 mm² gives I₂ = 64 A > 59.45 A, so 10 mm² (protection governs)', () => {
    const c = cond(chain('gG-fuse'));
    expect(c.size).toBe('10 mm²');
    expect(c.governing).toBe('protection');
    expect(c.device.rating).toBe(40); // IEC 60269-1 rated current ≥ 38 A (from memory)
    expect(c.device.coordination!.i2).toBeCloseTo(64, 9); // 1.6 × 40 (IEC 60269-1 Table 2, from memory)
    expect(c.device.coordination!.iz).toBe(57); // B.52.4 PVC C 3 loaded, 10 mm²
  });
});

describe('parallel sets (NEC 310.10(G), 310.15(C)(1))', () => {
  const chain = (conductor: Record<string, unknown>, sets = 2) => [
    { id: 'src', kind: 'battery', voltage: 48 },
    { id: 'run', kind: 'cable', from: 'src', length: 2, parallelSets: sets, conductor: nec(conductor) },
    { id: 'ld', kind: 'dc-load', from: 'run', power: 24000 },
  ];
  it('500 A in 2 sets: 4 current-carrying conductors (× 0.80); 350 kcmil 310 × 0.8 = 248 A < 250 A, 400 kcmil 268 A', () => {
    const c = cond(chain({}));
    expect(c.ampacity.groupingFactor).toBe(0.8); // Table 310.15(C)(1), 4–6 conductors
    expect(c.size).toBe('400 kcmil'); // Table 310.16 Cu 75 °C: 350 kcmil 310 A, 400 kcmil 335 A
    expect(c.device.rating).toBe(500); // 240.6(A) ≥ 500 A, ≤ 2 × 268 = 536 A
  });
  it('a size below 1/0 AWG in parallel is refused', () => {
    expect(refused(chain({ size: '2 AWG' }))).toEqual([expect.objectContaining({ elementId: 'run', field: 'conductor.size' })]);
  });
  it('the automatic ladder never offers a size below 1/0 AWG in parallel', () => {
    const c = cond([
      { id: 'src', kind: 'battery', voltage: 48 },
      { id: 'run', kind: 'cable', from: 'src', length: 1, parallelSets: 2, conductor: nec() },
      { id: 'ld', kind: 'dc-load', from: 'run', power: 480 },
    ]);
    expect(c.size).toBe('1/0 AWG'); // 10 A would fit 14 AWG, but parallel conductors start at 1/0 AWG
  });
});

describe('equipment ratings: drive input, charger output, DC-DC input', () => {
  it('a drive’s input conductors: 125 % of its rated input current (NEC 430.122(A)), whatever the motor draws today', () => {
    const c = cond([
      grid480,
      { id: 'run', kind: 'cable', from: 'src', length: 10, conductor: nec() },
      { id: 'vfd', kind: 'drive', from: 'run', outputVoltage: 460, outputFrequency: 45, inputPowerFactor: 0.95, ratedInputCurrent: 27, loss: { model: 'constant', efficiency: 0.97 } },
      ...motor('m', 'vfd', 15),
    ]);
    expect(c.designBasis.basis).toBe('drive-input');
    expect(c.designCurrent).toBeCloseTo(1.25 * 27, 12); // 430.122(A), hand
    // A 35 A circuit → 60 °C column (110.14(C)(1)(a)): 10 AWG 30 A < 33.75 A ≤ 8 AWG 40 A (Table 310.16)
    expect(c.size).toBe('8 AWG');
    expect(c.device.rating).toBe(35); // smallest 240.6(A) rating ≥ 33.75 A, ≤ 40 A
  });

  it('a charger’s output: 125 % of its rated output current; a DC-DC converter’s input: rated output / (η × lowest input voltage) × 1.25', () => {
    const elements = [
      { id: 'src', kind: 'grid', phases: 1, voltage: 240, frequency: 60 },
      { id: 'chg', kind: 'rectifier', from: 'src', outputVoltage: 54, inputPowerFactor: 0.99, ratedOutputCurrent: 40, loss: { model: 'constant', efficiency: 0.94 } },
      { id: 'run', kind: 'cable', from: 'chg', length: 3, conductor: nec() },
      { id: 'bus', kind: 'dc-bus', from: 'run', fixedLoss: 0 },
      { id: 'feed', kind: 'cable', from: 'bus', length: 3, conductor: nec() },
      { id: 'conv', kind: 'dc-dc', from: 'feed', outputVoltage: 12, ratedOutputPower: 600, minInputVoltage: 42, loss: { model: 'constant', efficiency: 0.9 } },
      { id: 'ld', kind: 'dc-load', from: 'conv', power: 200 },
      { id: 'lamp', kind: 'dc-load', from: 'bus', power: 300 },
    ];
    const charger = cond(elements, 'run');
    expect(charger.designBasis.basis).toBe('charger-output');
    expect(charger.designCurrent).toBeCloseTo(50, 12); // 1.25 × 40 A (hand)
    const feed = cond(elements, 'feed');
    expect(feed.designBasis.basis).toBe('dc-dc-input');
    expect(feed.designCurrent).toBeCloseTo((1.25 * 600) / (0.9 * 42), 9); // 19.84 A (hand)
  });
});

describe('a DC feeder to a bus with converters (a bank to its bus)', () => {
  it('each converter at its rated input current plus the other loads at nominal voltage, × 1.25', () => {
    const c = cond([
      { id: 'src', kind: 'battery', voltage: 51.2 },
      { id: 'run', kind: 'cable', from: 'src', length: 2, conductor: nec({ insulationRating: 90 }) },
      { id: 'bus', kind: 'dc-bus', from: 'run', fixedLoss: 0 },
      { id: 'inv', kind: 'inverter', from: 'bus', phases: 1, outputVoltage: 230, frequency: 50, ratedOutputPower: 3000, lowVoltageCutoff: 44, loss: { model: 'constant', efficiency: 0.94 } },
      { id: 'ac', kind: 'ac-load', from: 'inv', power: 500, powerFactor: 1 },
      { id: 'conv', kind: 'dc-dc', from: 'bus', outputVoltage: 12, ratedOutputPower: 240, minInputVoltage: 40, loss: { model: 'constant', efficiency: 0.9 } },
      { id: 'radio', kind: 'dc-load', from: 'conv', power: 60 },
      { id: 'lamp', kind: 'dc-load', from: 'bus', power: 51.2 },
    ]);
    expect(c.designBasis.basis).toBe('dc-feeder');
    // Hand: 3000 / (0.94 × 44) = 72.53 A; 240 / (0.9 × 40) = 6.667 A; 51.2 W / 51.2 V = 1 A; Σ = 80.20 A; × 1.25 (706.30).
    const base = 3000 / (0.94 * 44) + 240 / (0.9 * 40) + 1;
    expect(c.designBasis.baseCurrent).toBeCloseTo(base, 9);
    expect(c.designCurrent).toBeCloseTo(1.25 * base, 9);
  });
});
