/**
 * The bus voltage at transfer (a bank on a bus picking up the bus from float) against ngspice.
 *
 * Method: the modes study (core/studies/modes/study.ts) gives the bank's float EMF E_f = V_float −
 * I_float·R and solves the on-battery chain from it. SPICE gets the same circuit as a DC operating
 * point: a DC source E_f, the bank's internal resistance and the cable's loop resistance in series,
 * and at the bus the loads as SPICE models them on its own: a constant-current load as a current
 * source, a constant-power draw (the DC bus's fixed loss, the inverter's input: a regulating
 * converter's input power does not depend on its input voltage) as a behavioural source
 * I = P / V(bus). SPICE's Newton solve (tolerances tightened, started near the upper solution of
 * the constant-power equation) must give the bus voltage and the bank current the engine found.
 */
import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { requireNgspice, sp } from './ngspice.ts';
import { solveProject } from '../../core/index.ts';
import { solveModes } from '../../core/solve/modes.ts';
import { runModesStudy } from '../../core/studies/modes/study.ts';
import { demoProjects } from '../../core/demos/index.ts';
import type { Solved } from '../../core/solve/solved.ts';

/** A DC operating point: the named vectors, each a real number. */
function runOp(netlist: string, nodeset: string, vectors: readonly string[]): Record<string, number> {
  const ngspice = requireNgspice();
  const dir = mkdtempSync(join(tmpdir(), 'joulepath-spice-'));
  try {
    const out = join(dir, 'out.txt');
    const deck = ['* joulepath transfer circuit', netlist.trim(), '.options reltol=1e-12 vntol=1e-12 abstol=1e-15', `.nodeset ${nodeset}`, '.control', 'op', 'set wr_singlescale', 'option numdgt=15', `wrdata ${out} ${vectors.join(' ')}`, 'quit 0', '.endc', '.end', ''].join('\n');
    const cir = join(dir, 'circuit.cir');
    writeFileSync(cir, deck);
    const run = spawnSync(ngspice, ['-b', cir], { cwd: dir, encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] });
    const log = `${run.stdout ?? ''}\n${run.stderr ?? ''}`;
    if (run.status !== 0 || /\berror\b/i.test(log)) throw new Error(`ngspice failed (exit ${run.status}):\n${log}\n--- deck ---\n${deck}`);
    const nums = readFileSync(out, 'utf8').trim().split(/\s+/).map(Number);
    // With wr_singlescale on an operating point: one scale column, then one value per vector.
    if (nums.length !== 1 + vectors.length || nums.some((n) => !Number.isFinite(n))) throw new Error(`unexpected wrdata output: ${nums.join(' ')}`);
    return Object.fromEntries(vectors.map((v, k) => [v, nums[1 + k]!]));
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

const solved = (p: unknown): Solved => {
  const s = solveProject(p);
  if (!s.ok) throw new Error(JSON.stringify(s.problems));
  return s;
};

describe('the bus voltage at transfer against ngspice', () => {
  it('ngspice is installed (otherwise: apt-get install -y ngspice)', () => {
    expect(requireNgspice()).toBeTruthy();
  });

  it('a 48 V plant: bank, cable, a 30 A current load and a 1 kW constant-power converter on the bus', () => {
    const s = solved({
      format: 'joulepath-project',
      version: 2,
      name: 'plant',
      elements: [
        { id: 'grid', kind: 'grid', phases: 1, voltage: 230, frequency: 50 },
        { id: 'rect', kind: 'rectifier', from: 'grid', outputVoltage: 54, inputPowerFactor: 1, loss: { model: 'constant', efficiency: 0.9 } },
        { id: 'bus', kind: 'dc-bus', from: 'rect', fixedLoss: 0 },
        { id: 'bc', kind: 'cable', from: 'bus', length: 5, resistancePerKm: 2 },
        { id: 'bank', kind: 'battery', from: 'bc', bank: { chemistry: 'flooded-lead-acid', series: 24, capacityAh: 200, floatCurrent: 0.2 } },
        { id: 'radio', kind: 'dc-current-load', from: 'bus', current: 30 },
        // A DC-DC converter at 95 %: its input 950 W ÷ 0.95 = 1000 W whatever the bus voltage.
        { id: 'dcdc', kind: 'dc-dc', from: 'bus', outputVoltage: 12, loss: { model: 'constant', efficiency: 0.95 } },
        { id: 'aux', kind: 'dc-load', from: 'dcdc', power: 950 },
      ],
    });
    const out = runModesStudy(s)!;
    if (!out || !out.ok) throw new Error('no study');
    const t = out.study.transfer!;
    // Loop resistance of the cable: 2 × 5 m × 2 Ω/km = 0.02 Ω (go and return); bank R = 24 × 0.1 ÷ 200 = 0.012 Ω (preset, from memory).
    const spice = runOp(
      [`Vbank e 0 DC ${sp(t.floatEmf)}`, `Rint e t ${sp(t.internalResistance)}`, `Rcable t bus ${sp(0.02)}`, `Iradio bus 0 DC 30`, `Bdcdc bus 0 I = ${sp(1000)} / V(bus)`].join('\n'),
      `v(bus)=${sp(t.floatEmf)} v(t)=${sp(t.floatEmf)}`,
      ['v(bus)', 'i(Vbank)'],
    );
    // ngspice, DC operating point (tolerances 1e-12).
    expect(t.busVoltageAtTransfer).toBeCloseTo(spice['v(bus)']!, 8);
    expect(t.currentAtTransfer).toBeCloseTo(-spice['i(Vbank)']!, 7);
    // The choice: the bank takes the whole bus, about 48.5 A, well within its 1 C = 200 A.
    expect(t.currentAtTransfer).toBeGreaterThan(48);
    expect(t.currentAtTransfer).toBeLessThan(t.maxDischargeCurrent);
  });

  it('the online UPS demo: the bank through its cable to the bus, the bus loss and the inverter', () => {
    const demo = demoProjects.find((d) => d.id === 'harbour-clinic-ups')!;
    const s = solved(demo.project);
    const modes = solveModes(s)!;
    if (!modes.battery.ok) throw new Error('on battery does not solve');
    const out = runModesStudy(s, modes)!;
    if (!out || !out.ok) throw new Error('no study');
    const t = out.study.transfer!;
    const inverterIn = modes.battery.result.elements.find((e) => e.id === 'inverter')!.pIn;
    // Cable: 2 × 4 m × 0.727 Ω/km (the demo's figures); the bus's fixed loss 12 W (the demo's).
    const spice = runOp(
      [`Vbank e 0 DC ${sp(t.floatEmf)}`, `Rint e t ${sp(t.internalResistance)}`, `Rcable t bus ${sp((2 * 4 * 0.727) / 1000)}`, `Bbus bus 0 I = ${sp(12)} / V(bus)`, `Binv bus 0 I = ${sp(inverterIn)} / V(bus)`].join('\n'),
      `v(bus)=${sp(t.floatEmf)} v(t)=${sp(t.floatEmf)}`,
      ['v(bus)', 'i(Vbank)'],
    );
    expect(t.busVoltageAtTransfer).toBeCloseTo(spice['v(bus)']!, 8);
    expect(t.currentAtTransfer).toBeCloseTo(-spice['i(Vbank)']!, 7);
  });
});
