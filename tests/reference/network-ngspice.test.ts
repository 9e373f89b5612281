/**
 * Loads from circuit elements against ngspice (an independent circuit simulator, AC analysis).
 *
 * Method, per case: solve the project with the engine; build the same circuit in SPICE with the
 * network's own resistors, inductors and capacitors (not an equivalent impedance) — source EMF
 * (rms amplitude, so SPICE phasors are rms), source impedance, cable conductors as R + L, the
 * network between line and neutral (single-phase, star) or between lines (delta) — and run an AC
 * analysis at the frequency. Load voltage magnitude and angle, line current, load P and Q, cable
 * I²R loss and source P and Q must agree within 0.1 % (angles within 0.01°), as in ngspice.test.ts.
 * A last case checks a power-factor correction: the chain re-solved with the capacitor bank
 * (delta) beside the load, against the same circuit with the capacitors in SPICE.
 */
import { describe, expect, it } from 'vitest';
import { correctPowerFactor, parseNetwork, solveProject, type CircuitNetwork, type ElementResult, type ParsedNetwork, type Project, type SolveResult } from '../../core/index.ts';
import { requireNgspice, runAc, seriesBranch, sp, type Phasor } from './ngspice.ts';
import { cneg, cabs, cargDeg, power, csum } from './phasor.ts';
import { Agreement, agreementSummary, projectOf } from './agreement.ts';
import { onSolved } from '../core/solved.ts';

const polarDeg = (r: number, deg: number): Phasor => ({ re: r * Math.cos((deg * Math.PI) / 180), im: r * Math.sin((deg * Math.PI) / 180) });



const summary = agreementSummary('Network loads vs ngspice agreement');

const project = projectOf;

function solveOk(p: Project): SolveResult {
  const out = solveProject(p);
  if (!out.ok) throw new Error(`engine refused the case: ${JSON.stringify(out.problems)}`);
  return out.result;
}
const el = (r: SolveResult, id: string): ElementResult => r.elements.find((e) => e.id === id)!;

/** SPICE lines of a network between nodes a and b, each component under a unique name. */
function networkLines(prefix: string, a: string, b: string, raw: CircuitNetwork): string[] {
  const parsed = parseNetwork(raw);
  if (!parsed.ok) throw new Error('test network does not read');
  let counter = 0;
  const lines: string[] = [];
  const emit = (n: ParsedNetwork, from: string, to: string): void => {
    if (!('items' in n)) {
      const letter = n.type === 'resistor' ? 'R' : n.type === 'inductor' ? 'L' : 'C';
      lines.push(`${letter}${prefix}_${++counter} ${from} ${to} ${sp(n.value)}`);
      return;
    }
    if (n.type === 'parallel') {
      for (const item of n.items) emit(item, from, to);
      return;
    }
    let node = from;
    n.items.forEach((item, k) => {
      const next = k === n.items.length - 1 ? to : `${prefix}_n${++counter}`;
      emit(item, node, next);
      node = next;
    });
  };
  emit(parsed.network, a, b);
  return lines;
}

const PHASES = [
  ['a', 0],
  ['b', -120],
  ['c', 120],
] as const;

describe('network loads against ngspice', () => {
  it('ngspice is installed (otherwise: apt-get install -y ngspice)', () => {
    expect(requireNgspice()).toBeTruthy();
  });

  it('(n1) single-phase 230 V 50 Hz: source impedance, 80 m cable, 15 Ω + (60 mH ∥ 150 µF) + 4.7 Ω ∥ 33 Ω', () => {
    const f = 50;
    const [rs, xs] = [0.12, 0.2];
    const len = 80;
    const rkm = 4.61; // Ω/km, one conductor (about 4 mm² copper; from memory)
    const xkm = 0.1;
    const network: CircuitNetwork = {
      series: [{ resistor: '15 Ω' }, { parallel: [{ inductor: '60 mH' }, { capacitor: '150 µF' }] }, { parallel: [{ resistor: 4.7 }, { resistor: '33' }] }],
    };
    const r = solveOk(
      project('1φ network', [
        { id: 'sup', kind: 'grid', phases: 1, voltage: 230, frequency: f, resistance: rs, reactance: xs },
        { id: 'cab', kind: 'cable', from: 'sup', length: len, resistancePerKm: rkm, reactancePerKm: xkm },
        { id: 'ld', kind: 'network-load', from: 'cab', network },
      ]),
    );
    const rc = (rkm * len) / 1000;
    const xc = (xkm * len) / 1000;
    const netlist = [
      `Vsup e 0 AC ${sp(230)} 0`,
      seriesBranch('src', 'e', 't', rs, xs, f),
      seriesBranch('go', 't', 'a', rc, xc, f),
      ...networkLines('ld', 'a', 'n', network),
      seriesBranch('ret', 'n', '0', rc, xc, f),
    ].join('\n');
    const s = runAc(netlist, f, ['v(a,n)', 'i(Vsup)', 'v(t)', 'v(t,a)', 'v(n)']);
    const i = cneg(s['i(Vsup)']!);
    const vLoad = s['v(a,n)']!;
    const sLoad = power(vLoad, i);
    const sEmf = power({ re: 230, im: 0 }, i);
    const pCable = power(s['v(t,a)']!, i).re + power(s['v(n)']!, i).re;
    const ld = el(r, 'ld');
    const ag = new Agreement('(n1) 1φ network load behind source Z and cable');
    ag.rel('load voltage |V|', ld.input!.voltage, cabs(vLoad));
    ag.angle('load voltage angle', cargDeg(ld.input!.phasor!.voltage), cargDeg(vLoad));
    ag.rel('line current', ld.input!.current, cabs(i));
    ag.angle('line current angle', cargDeg(ld.input!.phasor!.current), cargDeg(i));
    ag.rel('load P', ld.input!.p, sLoad.re);
    ag.rel('load Q', ld.input!.q, sLoad.im);
    ag.rel('cable I²R loss', el(r, 'cab').loss, pCable);
    ag.rel('source EMF P', r.totals.sourcePower, sEmf.re);
    summary.push(ag);
  });

  it('(n2) three-phase 400 V 50 Hz, star per phase: 200 m cable, 9 Ω + 30 mH with 47 µF across the pair', () => {
    const f = 50;
    const len = 200;
    const rkm = 1.15; // Ω/km (about 16 mm² copper; from memory)
    const xkm = 0.09;
    const vPh = 400 / Math.sqrt(3);
    const network: CircuitNetwork = { parallel: [{ series: [{ resistor: '9 Ω' }, { inductor: '30 mH' }] }, { capacitor: '47 µF' }] };
    const r = solveOk(
      project('3φ star network', [
        { id: 'sup', kind: 'grid', phases: 3, voltage: 400, frequency: f },
        { id: 'cab', kind: 'cable', from: 'sup', length: len, resistancePerKm: rkm, reactancePerKm: xkm },
        { id: 'ld', kind: 'network-load', from: 'cab', connection: 'star', network },
      ]),
    );
    const rc = (rkm * len) / 1000;
    const xc = (xkm * len) / 1000;
    const lines: string[] = [];
    for (const [ph, deg] of PHASES) {
      lines.push(`V${ph} s${ph} 0 AC ${sp(vPh)} ${deg}`);
      lines.push(seriesBranch(`c${ph}`, `s${ph}`, `l${ph}`, rc, xc, f));
      lines.push(...networkLines(`z${ph}`, `l${ph}`, 'ln', network));
    }
    lines.push(seriesBranch('cn', 'ln', '0', rc, xc, f)); // neutral: carries nothing when balanced
    const s = runAc(lines.join('\n'), f, ['v(la,ln)', 'v(la,lb)', 'i(Va)', 'i(Vb)', 'i(Vc)', 'v(sa,la)', 'v(sb,lb)', 'v(sc,lc)', 'v(lb,ln)', 'v(lc,ln)']);
    const ia = cneg(s['i(Va)']!);
    const ib = cneg(s['i(Vb)']!);
    const ic = cneg(s['i(Vc)']!);
    const sLoad = csum(power(s['v(la,ln)']!, ia), power(s['v(lb,ln)']!, ib), power(s['v(lc,ln)']!, ic));
    const sSrc = csum(power(polarDeg(vPh, 0), ia), power(polarDeg(vPh, -120), ib), power(polarDeg(vPh, 120), ic));
    const pCable = power(s['v(sa,la)']!, ia).re + power(s['v(sb,lb)']!, ib).re + power(s['v(sc,lc)']!, ic).re;
    const ld = el(r, 'ld');
    const ag = new Agreement('(n2) 3φ star network load behind a cable');
    ag.rel('load line voltage |V_ab|', ld.input!.voltage, cabs(s['v(la,lb)']!));
    ag.angle('load voltage angle, phase a', cargDeg(ld.input!.phasor!.voltage), cargDeg(s['v(la,ln)']!));
    ag.rel('line current', ld.input!.current, cabs(ia));
    ag.angle('line current angle', cargDeg(ld.input!.phasor!.current), cargDeg(ia));
    ag.rel('load P (3 phases)', ld.input!.p, sLoad.re);
    ag.rel('load Q (3 phases)', ld.input!.q, sLoad.im);
    ag.rel('cable I²R loss', el(r, 'cab').loss, pCable);
    ag.rel('source P', r.totals.sourcePower, sSrc.re);
    ag.rel('source Q', el(r, 'sup').output!.q, sSrc.im);
    summary.push(ag);
  });

  it('(n3) three-phase 480 V 60 Hz, delta: generator impedance, 150 m cable, each branch 22 Ω ∥ (4.7 Ω + 18 mH)', () => {
    const f = 60;
    const [rs, xs] = [0.02, 0.09];
    const len = 150;
    const rkm = 0.524; // Ω/km (about 35 mm² copper; from memory)
    const xkm = 0.086;
    const vPh = 480 / Math.sqrt(3);
    const network: CircuitNetwork = { parallel: [{ resistor: '22' }, { series: [{ resistor: '4.7 Ω' }, { inductor: '18 mH' }] }] };
    const r = solveOk(
      project('3φ delta network', [
        { id: 'gen', kind: 'generator', phases: 3, voltage: 480, frequency: f, resistance: rs, reactance: xs },
        { id: 'cab', kind: 'cable', from: 'gen', length: len, resistancePerKm: rkm, reactancePerKm: xkm },
        { id: 'ld', kind: 'network-load', from: 'cab', connection: 'delta', network },
      ]),
    );
    const rc = (rkm * len) / 1000;
    const xc = (xkm * len) / 1000;
    const lines: string[] = [];
    for (const [ph, deg] of PHASES) {
      lines.push(`V${ph} e${ph} 0 AC ${sp(vPh)} ${deg}`);
      lines.push(seriesBranch(`g${ph}`, `e${ph}`, `t${ph}`, rs, xs, f));
      lines.push(seriesBranch(`c${ph}`, `t${ph}`, `l${ph}`, rc, xc, f));
    }
    // Delta: the network between each pair of lines; three wires, no neutral.
    lines.push(...networkLines('zab', 'la', 'lb', network), ...networkLines('zbc', 'lb', 'lc', network), ...networkLines('zca', 'lc', 'la', network));
    const s = runAc(lines.join('\n'), f, ['v(la,lb)', 'v(lb,lc)', 'v(lc,la)', 'i(Va)', 'i(Vb)', 'i(Vc)', 'v(ta,la)', 'v(tb,lb)', 'v(tc,lc)', 'v(la)', 'v(lb)', 'v(lc)']);
    const ia = cneg(s['i(Va)']!);
    const ib = cneg(s['i(Vb)']!);
    const ic = cneg(s['i(Vc)']!);
    // Power into a 3-wire load: Σ V_line-to-ground·conj(I_line) (ground = source star point; the sum of the line currents is 0).
    const sLoad = csum(power(s['v(la)']!, ia), power(s['v(lb)']!, ib), power(s['v(lc)']!, ic));
    const sEmf = csum(power(polarDeg(vPh, 0), ia), power(polarDeg(vPh, -120), ib), power(polarDeg(vPh, 120), ic));
    const pCable = power(s['v(ta,la)']!, ia).re + power(s['v(tb,lb)']!, ib).re + power(s['v(tc,lc)']!, ic).re;
    const ld = el(r, 'ld');
    // The engine's per-phase voltage is the star equivalent: V_an = V_ab·e^{−j30°}/√3 in a balanced set.
    const vab = s['v(la,lb)']!;
    const ag = new Agreement('(n3) 3φ delta network load behind generator Z and cable');
    ag.rel('load line voltage |V_ab|', ld.input!.voltage, cabs(vab));
    ag.rel('load line voltage |V_bc|', ld.input!.voltage, cabs(s['v(lb,lc)']!));
    ag.angle('load star-equivalent voltage angle (V_ab − 30°)', cargDeg(ld.input!.phasor!.voltage), cargDeg(vab) - 30);
    ag.rel('line current', ld.input!.current, cabs(ia));
    ag.angle('line current angle, phase a', cargDeg(ld.input!.phasor!.current), cargDeg(ia));
    ag.rel('load P (3 branches)', ld.input!.p, sLoad.re);
    ag.rel('load Q (3 branches)', ld.input!.q, sLoad.im);
    ag.rel('cable I²R loss', el(r, 'cab').loss, pCable);
    ag.rel('source EMF P', r.totals.sourcePower, sEmf.re);
    ag.rel('generator internal loss', el(r, 'gen').loss, sEmf.re - (sLoad.re + pCable));
    summary.push(ag);
  });

  it('(n4) power-factor correction re-solved: a lagging star network with its delta capacitor bank, against the same circuit', () => {
    const f = 50;
    const len = 120;
    const rkm = 0.727; // Ω/km (about 25 mm² copper; from memory)
    const xkm = 0.08;
    const vPh = 400 / Math.sqrt(3);
    const network: CircuitNetwork = { series: [{ resistor: '6.2 Ω' }, { inductor: '22 mH' }] };
    const p = project('corrected feeder', [
      { id: 'sup', kind: 'grid', phases: 3, voltage: 400, frequency: f },
      { id: 'cab', kind: 'cable', from: 'sup', length: len, resistancePerKm: rkm, reactancePerKm: xkm },
      { id: 'comp', kind: 'network-load', from: 'cab', connection: 'star', network },
    ]);
    const out = onSolved(correctPowerFactor, p, { at: 'comp', targetPowerFactor: 0.95 });
    if (!out.ok) throw new Error(JSON.stringify(out.problems));
    const c = out.correction;
    const farads = c.bank.capacitance.delta!;
    const r = c.resultAfter;
    const rc = (rkm * len) / 1000;
    const xc = (xkm * len) / 1000;
    const lines: string[] = [];
    for (const [ph, deg] of PHASES) {
      lines.push(`V${ph} s${ph} 0 AC ${sp(vPh)} ${deg}`);
      lines.push(seriesBranch(`c${ph}`, `s${ph}`, `l${ph}`, rc, xc, f));
      lines.push(...networkLines(`z${ph}`, `l${ph}`, 'ln', network));
    }
    lines.push('Rn ln 0 1e-3');
    lines.push(`Cab la lb ${sp(farads)}`, `Cbc lb lc ${sp(farads)}`, `Cca lc la ${sp(farads)}`);
    const s = runAc(lines.join('\n'), f, ['v(la,lb)', 'i(Va)', 'i(Vb)', 'i(Vc)', 'v(sa,la)', 'v(sb,lb)', 'v(sc,lc)', 'v(la)', 'v(lb)', 'v(lc)']);
    const ia = cneg(s['i(Va)']!);
    const ib = cneg(s['i(Vb)']!);
    const ic = cneg(s['i(Vc)']!);
    const sSrc = csum(power(polarDeg(vPh, 0), ia), power(polarDeg(vPh, -120), ib), power(polarDeg(vPh, 120), ic));
    const sAtLoad = csum(power(s['v(la)']!, ia), power(s['v(lb)']!, ib), power(s['v(lc)']!, ic)); // load and bank together
    const pCable = power(s['v(sa,la)']!, ia).re + power(s['v(sb,lb)']!, ib).re + power(s['v(sc,lc)']!, ic).re;
    const ag = new Agreement('(n4) 3φ network load + delta correction bank (re-solve)');
    ag.rel('cable current after correction', el(r, 'cab').input!.current, cabs(ia));
    ag.rel('load line voltage', el(r, 'comp').input!.voltage, cabs(s['v(la,lb)']!));
    ag.rel('corrected interface P', c.afterSolved.p, sAtLoad.re);
    ag.rel('corrected interface Q', c.afterSolved.q, sAtLoad.im);
    ag.rel('corrected interface pf', c.afterSolved.powerFactor, sAtLoad.re / cabs(sAtLoad));
    ag.rel('cable loss after', el(r, 'cab').loss, pCable);
    ag.rel('source P after', c.source.pAfter, sSrc.re);
    ag.rel('source Q after', c.source.qAfter, sSrc.im);
    ag.rel('source kVA after', c.source.sAfter, cabs(sSrc));
    expect(c.source.sAfter).toBeLessThan(c.source.sBefore);
    summary.push(ag);
  });
});
