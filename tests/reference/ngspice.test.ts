/**
 * The engine's AC solve against ngspice (an independent circuit simulator, AC analysis).
 *
 * Method, per case: solve the project with the engine (constant-power loads); take each load's solved
 * per-phase voltage phasor V and complex power S_phase and turn the load into the impedance that draws
 * exactly that power at that voltage, Z = |V|²/conj(S_phase) (series R + L when lagging, R + C when
 * leading, L = X/(2πf), C = 1/(2πf|X|)). Build the same circuit in SPICE — source EMF (rms amplitude,
 * so SPICE phasors are rms), source impedance, cable conductors as R + L, transformer as an ideal
 * ratio plus its series impedance, the load impedances — and run an AC analysis at the frequency.
 * If the engine's operating point is right, SPICE reproduces it: load voltage magnitude and angle,
 * line current, source real and reactive power, cable I²R loss, within 0.1 % (angles within 0.01°).
 *
 * Conventions mirrored from the engine: a single-phase cable's impedance is its loop (go and return
 * conductors, each modelled separately here); three-phase is per conductor, 4-wire star, with the
 * source phases at 0/−120/+120°; source resistance/reactance are per phase; engine voltages are rms
 * (line-to-line on three-phase), engine phasors per phase (phase-to-neutral on three-phase), angles
 * referred to the source EMF (or the regulating converter's output) at 0°.
 */
import { describe, expect, it } from 'vitest';
import { solveProject, type ElementResult, type Project, type SolveResult } from '../../core/index.ts';
import { requireNgspice, runAc, seriesBranch, sp, type Phasor } from './ngspice.ts';
import { cneg, cabs, cargDeg, power, csum } from './phasor.ts';
import { Agreement, agreementSummary, projectOf } from './agreement.ts';



function solveOk(project: Project): SolveResult {
  const out = solveProject(project);
  if (!out.ok) throw new Error(`engine refused the case: ${JSON.stringify(out.problems)}`);
  return out.result;
}

function el(result: SolveResult, id: string): ElementResult {
  const e = result.elements.find((x) => x.id === id);
  if (!e) throw new Error(`no element ${id} in the result`);
  return e;
}

/** Per-phase equivalent impedance of a solved constant-power load: Z = |V|²/conj(S_phase). */
function loadImpedance(load: ElementResult): { r: number; x: number } {
  const port = load.input!;
  const m = port.kind === 'ac3' ? 3 : 1;
  const v = port.phasor!.voltage;
  const v2 = v.re * v.re + v.im * v.im;
  const p = port.p / m;
  const q = port.q / m;
  // |V|²/(P − jQ) = |V|²(P + jQ)/(P² + Q²)
  const d = p * p + q * q;
  return { r: (v2 * p) / d, x: (v2 * q) / d };
}

const summary = agreementSummary('Engine vs ngspice agreement');

const project = projectOf;

describe('engine AC solve against ngspice', () => {
  it('ngspice is installed (otherwise: apt-get install -y ngspice)', () => {
    // Never skipped: a missing simulator fails here with the install command, in CI and locally.
    expect(requireNgspice()).toBeTruthy();
  });

  it('(a) single-phase: stiff 230 V 50 Hz supply, 60 m cable, 4 kW load at pf 0.85 lagging', () => {
    const f = 50;
    const len = 60;
    const rkm = 4.61; // Ω/km, one conductor (about 4 mm² copper; from memory)
    const xkm = 0.1;
    const result = solveOk(
      project('1φ feeder', [
        { id: 'sup', kind: 'grid', phases: 1, voltage: 230, frequency: f },
        { id: 'cab', kind: 'cable', from: 'sup', length: len, resistancePerKm: rkm, reactancePerKm: xkm },
        { id: 'ld', kind: 'ac-load', from: 'cab', power: 4000, powerFactor: 0.85 },
      ]),
    );
    const ld = el(result, 'ld');
    const zl = loadImpedance(ld);
    const rc = (rkm * len) / 1000; // one conductor; the engine's loop is 2 × this
    const xc = (xkm * len) / 1000;
    const netlist = [
      `Vsup s 0 AC ${sp(230)} 0`,
      seriesBranch('go', 's', 'a', rc, xc, f), // line conductor
      seriesBranch('ld', 'a', 'n', zl.r, zl.x, f), // load equivalent impedance
      seriesBranch('ret', 'n', '0', rc, xc, f), // neutral (return) conductor
    ].join('\n');
    const s = runAc(netlist, f, ['v(a,n)', 'i(Vsup)', 'v(s,a)', 'v(n)']);
    const i = cneg(s['i(Vsup)']!); // current delivered by the source
    const vLoad = s['v(a,n)']!;
    const sSrc = power({ re: 230, im: 0 }, i);
    const pCable = power(s['v(s,a)']!, i).re + power(s['v(n)']!, i).re; // go + return conductor

    const ag = new Agreement('(a) 1φ feeder + load');
    ag.rel('load voltage |V|', ld.input!.voltage, cabs(vLoad));
    ag.angle('load voltage angle', cargDeg(ld.input!.phasor!.voltage), cargDeg(vLoad));
    ag.rel('line current', ld.input!.current, cabs(i));
    ag.rel('cable current', el(result, 'cab').input!.current, cabs(i));
    ag.rel('source P', result.totals.sourcePower, sSrc.re);
    ag.rel('source Q', el(result, 'sup').output!.q, sSrc.im);
    ag.rel('cable I²R loss', el(result, 'cab').loss, pCable);
    summary.push(ag);
  });

  it('(a2) single-phase 60 Hz: source impedance, one cable feeding a leading and a lagging load in parallel', () => {
    const f = 60;
    const len = 35;
    const rkm = 7.41; // Ω/km (about 2.5 mm² copper at 70 °C; from memory)
    const xkm = 0.11;
    const [rs, xs] = [0.05, 0.15];
    const result = solveOk(
      project('1φ two loads', [
        { id: 'sup', kind: 'grid', phases: 1, voltage: 240, frequency: f, resistance: rs, reactance: xs },
        { id: 'cab', kind: 'cable', from: 'sup', length: len, resistancePerKm: rkm, reactancePerKm: xkm },
        { id: 'ups', kind: 'ac-va-load', from: 'cab', apparentPower: 3000, powerFactor: 0.9, pfSense: 'leading' },
        { id: 'pump', kind: 'ac-load', from: 'cab', power: 1500, powerFactor: 0.7 },
      ]),
    );
    const z1 = loadImpedance(el(result, 'ups'));
    const z2 = loadImpedance(el(result, 'pump'));
    expect(z1.x).toBeLessThan(0); // leading: modelled as R + C
    const rc = (rkm * len) / 1000;
    const xc = (xkm * len) / 1000;
    const netlist = [
      `Vsup e 0 AC ${sp(240)} 0`,
      seriesBranch('src', 'e', 't', rs, xs, f), // source internal impedance
      seriesBranch('go', 't', 'a', rc, xc, f),
      seriesBranch('ups', 'a', 'n', z1.r, z1.x, f),
      seriesBranch('pump', 'a', 'n', z2.r, z2.x, f),
      seriesBranch('ret', 'n', '0', rc, xc, f),
    ].join('\n');
    const s = runAc(netlist, f, ['v(a,n)', 'i(Vsup)', 'v(t)', 'v(t,a)', 'v(n)']);
    const i = cneg(s['i(Vsup)']!);
    const vLoad = s['v(a,n)']!;
    const sEmf = power({ re: 240, im: 0 }, i);
    const sTerm = power(s['v(t)']!, i);
    const pCable = power(s['v(t,a)']!, i).re + power(s['v(n)']!, i).re;

    const ag = new Agreement('(a2) 1φ source Z + cable + 2 loads (60 Hz, leading + lagging)');
    const ups = el(result, 'ups');
    ag.rel('load voltage |V|', ups.input!.voltage, cabs(vLoad));
    ag.angle('load voltage angle', cargDeg(ups.input!.phasor!.voltage), cargDeg(vLoad));
    ag.rel('line current', el(result, 'cab').input!.current, cabs(i));
    ag.rel('source EMF P', result.totals.sourcePower, sEmf.re);
    ag.rel('source terminal P', el(result, 'sup').output!.p, sTerm.re);
    ag.rel('source terminal Q', el(result, 'sup').output!.q, sTerm.im);
    ag.rel('source internal loss', el(result, 'sup').loss, sEmf.re - sTerm.re);
    ag.rel('cable I²R loss', el(result, 'cab').loss, pCable);
    summary.push(ag);
  });

  it('(a3) single-phase heavily loaded: source impedance and a long cable, load voltage sagging below 75 %', () => {
    // Several links in series near the nose of the P–V curve: the engine's fixed-point sweep must still
    // land on the circuit's own operating point.
    const f = 50;
    const len = 50;
    const rkm = 7.41;
    const xkm = 0.11;
    const [rs, xs] = [0.3, 0.4];
    const result = solveOk(
      project('1φ heavy', [
        { id: 'sup', kind: 'grid', phases: 1, voltage: 230, frequency: f, resistance: rs, reactance: xs },
        { id: 'cab', kind: 'cable', from: 'sup', length: len, resistancePerKm: rkm, reactancePerKm: xkm },
        { id: 'ld', kind: 'ac-load', from: 'cab', power: 10_000, powerFactor: 0.9 },
      ]),
    );
    const ld = el(result, 'ld');
    expect(ld.input!.voltage / 230).toBeLessThan(0.75); // really heavily loaded
    const zl = loadImpedance(ld);
    const rc = (rkm * len) / 1000;
    const xc = (xkm * len) / 1000;
    const netlist = [
      `Vsup e 0 AC ${sp(230)} 0`,
      seriesBranch('src', 'e', 't', rs, xs, f),
      seriesBranch('go', 't', 'a', rc, xc, f),
      seriesBranch('ld', 'a', 'n', zl.r, zl.x, f),
      seriesBranch('ret', 'n', '0', rc, xc, f),
    ].join('\n');
    const s = runAc(netlist, f, ['v(a,n)', 'i(Vsup)', 'v(t)', 'v(t,a)', 'v(n)']);
    const i = cneg(s['i(Vsup)']!);
    const vLoad = s['v(a,n)']!;
    const sEmf = power({ re: 230, im: 0 }, i);
    const sTerm = power(s['v(t)']!, i);
    const pCable = power(s['v(t,a)']!, i).re + power(s['v(n)']!, i).re;

    const ag = new Agreement(`(a3) 1φ heavy load (load at ${((100 * ld.input!.voltage) / 230).toFixed(1)} % voltage, ${result.method.iterations} sweeps)`);
    ag.rel('load voltage |V|', ld.input!.voltage, cabs(vLoad));
    ag.angle('load voltage angle', cargDeg(ld.input!.phasor!.voltage), cargDeg(vLoad));
    ag.rel('line current', ld.input!.current, cabs(i));
    ag.rel('source EMF P', result.totals.sourcePower, sEmf.re);
    ag.rel('source terminal P', el(result, 'sup').output!.p, sTerm.re);
    ag.rel('source terminal Q', el(result, 'sup').output!.q, sTerm.im);
    ag.rel('cable I²R loss', el(result, 'cab').loss, pCable);
    summary.push(ag);
  });

  it('(b) three-phase 4-wire: 400 V 50 Hz star source, 150 m cable (R + L per conductor), 60 kW star load at pf 0.88', () => {
    const f = 50;
    const len = 150;
    const rkm = 0.387; // Ω/km (about 50 mm² copper; from memory)
    const xkm = 0.08;
    const vPh = 400 / Math.sqrt(3);
    const result = solveOk(
      project('3φ feeder', [
        { id: 'sup', kind: 'grid', phases: 3, voltage: 400, frequency: f },
        { id: 'cab', kind: 'cable', from: 'sup', length: len, resistancePerKm: rkm, reactancePerKm: xkm },
        { id: 'ld', kind: 'ac-load', from: 'cab', power: 60000, powerFactor: 0.88 },
      ]),
    );
    const ld = el(result, 'ld');
    const zl = loadImpedance(ld);
    const rc = (rkm * len) / 1000;
    const xc = (xkm * len) / 1000;
    const lines: string[] = [];
    const phases = [
      ['a', 0],
      ['b', -120],
      ['c', 120],
    ] as const;
    for (const [ph, deg] of phases) {
      lines.push(`V${ph} s${ph} 0 AC ${sp(vPh)} ${deg}`);
      lines.push(seriesBranch(`c${ph}`, `s${ph}`, `l${ph}`, rc, xc, f));
      lines.push(seriesBranch(`z${ph}`, `l${ph}`, 'ln', zl.r, zl.x, f));
    }
    // Neutral conductor, same size as the phases: carries nothing for a balanced load.
    lines.push(seriesBranch('cn', 'ln', '0', rc, xc, f));
    const s = runAc(lines.join('\n'), f, [
      'v(la,ln)',
      'v(lb,ln)',
      'v(lc,ln)',
      'v(la,lb)',
      'i(Va)',
      'i(Vb)',
      'i(Vc)',
      'v(sa,la)',
      'v(sb,lb)',
      'v(sc,lc)',
      'v(ln)',
    ]);
    const ia = cneg(s['i(Va)']!);
    const ib = cneg(s['i(Vb)']!);
    const ic = cneg(s['i(Vc)']!);
    const emf = (deg: number): Phasor => ({ re: vPh * Math.cos((deg * Math.PI) / 180), im: vPh * Math.sin((deg * Math.PI) / 180) });
    const sSrc = csum(power(emf(0), ia), power(emf(-120), ib), power(emf(120), ic));
    const pCable = power(s['v(sa,la)']!, ia).re + power(s['v(sb,lb)']!, ib).re + power(s['v(sc,lc)']!, ic).re;
    const iN = cabs(csum(ia, ib, ic));

    const ag = new Agreement('(b) 3φ 4-wire feeder + star load');
    const vE = ld.input!.phasor!.voltage;
    ag.rel('load phase voltage |V_an|', cabs(vE), cabs(s['v(la,ln)']!));
    ag.rel('load line voltage |V_ab| (engine LL)', ld.input!.voltage, cabs(s['v(la,lb)']!));
    ag.angle('load voltage angle, phase a', cargDeg(vE), cargDeg(s['v(la,ln)']!));
    ag.angle('load voltage angle, phase b (engine a − 120°)', cargDeg(vE) - 120, cargDeg(s['v(lb,ln)']!));
    ag.angle('load voltage angle, phase c (engine a + 120°)', cargDeg(vE) + 120, cargDeg(s['v(lc,ln)']!));
    ag.rel('line current (phase a)', ld.input!.current, cabs(ia));
    ag.rel('line current (phase c)', el(result, 'cab').input!.current, cabs(ic));
    ag.angle('line current angle, phase a', cargDeg(ld.input!.phasor!.current), cargDeg(ia));
    ag.rel('source P (3 phases)', result.totals.sourcePower, sSrc.re);
    ag.rel('source Q (3 phases)', el(result, 'sup').output!.q, sSrc.im);
    ag.rel('cable I²R loss (3 conductors)', el(result, 'cab').loss, pCable);
    ag.nearZero('neutral current, A', iN, 1e-6 * cabs(ia));
    summary.push(ag);
  });

  it('(b2) three-phase from an inverter (its output is the 0° reference): cable to a leading 25 kVA load', () => {
    const f = 50;
    const len = 40;
    const rkm = 1.15; // Ω/km (about 16 mm² copper; from memory)
    const xkm = 0.09;
    const vPh = 400 / Math.sqrt(3);
    const result = solveOk(
      project('3φ inverter feeder', [
        { id: 'bat', kind: 'battery', voltage: 800, internalResistance: 0.2 },
        { id: 'inv', kind: 'inverter', from: 'bat', phases: 3, outputVoltage: 400, frequency: f, loss: { model: 'constant', efficiency: 0.97 } },
        { id: 'cab', kind: 'cable', from: 'inv', length: len, resistancePerKm: rkm, reactancePerKm: xkm },
        { id: 'ld', kind: 'ac-va-load', from: 'cab', apparentPower: 25000, powerFactor: 0.8, pfSense: 'leading' },
      ]),
    );
    const ld = el(result, 'ld');
    const zl = loadImpedance(ld);
    expect(zl.x).toBeLessThan(0);
    const rc = (rkm * len) / 1000;
    const xc = (xkm * len) / 1000;
    const lines: string[] = [];
    for (const [ph, deg] of [
      ['a', 0],
      ['b', -120],
      ['c', 120],
    ] as const) {
      lines.push(`V${ph} s${ph} 0 AC ${sp(vPh)} ${deg}`);
      lines.push(seriesBranch(`c${ph}`, `s${ph}`, `l${ph}`, rc, xc, f));
      lines.push(seriesBranch(`z${ph}`, `l${ph}`, 'ln', zl.r, zl.x, f));
    }
    lines.push(`Rn ln 0 ${sp(rc)}`);
    const s = runAc(lines.join('\n'), f, ['v(la,ln)', 'v(la,lb)', 'i(Va)', 'i(Vb)', 'i(Vc)', 'v(sa,la)', 'v(sb,lb)', 'v(sc,lc)']);
    const ia = cneg(s['i(Va)']!);
    const ib = cneg(s['i(Vb)']!);
    const ic = cneg(s['i(Vc)']!);
    const emf = (deg: number): Phasor => ({ re: vPh * Math.cos((deg * Math.PI) / 180), im: vPh * Math.sin((deg * Math.PI) / 180) });
    const sInv = csum(power(emf(0), ia), power(emf(-120), ib), power(emf(120), ic));
    const pCable = power(s['v(sa,la)']!, ia).re + power(s['v(sb,lb)']!, ib).re + power(s['v(sc,lc)']!, ic).re;

    const ag = new Agreement('(b2) 3φ inverter + cable + leading load');
    ag.rel('load line voltage |V_ab|', ld.input!.voltage, cabs(s['v(la,lb)']!));
    ag.angle('load voltage angle, phase a', cargDeg(ld.input!.phasor!.voltage), cargDeg(s['v(la,ln)']!));
    ag.rel('line current', ld.input!.current, cabs(ia));
    ag.rel('inverter output P', el(result, 'inv').output!.p, sInv.re);
    ag.rel('inverter output Q (leading, negative)', el(result, 'inv').output!.q, sInv.im);
    ag.rel('cable I²R loss', el(result, 'cab').loss, pCable);
    summary.push(ag);
  });

  it('(c) three-phase generator with internal impedance, cable and 690/400 V transformer feeding a 200 kW load', () => {
    const f = 50;
    const len = 80;
    const rkm = 0.253; // Ω/km (about 70 mm² copper; from memory)
    const xkm = 0.08;
    const [rs, xs] = [0.01, 0.06];
    const tx = { sr: 315_000, vp: 690, vs: 400, nl: 650, ll: 3900, zPct: 4.5 };
    const result = solveOk(
      project('generator, cable, transformer', [
        { id: 'gen', kind: 'generator', phases: 3, voltage: tx.vp, frequency: f, resistance: rs, reactance: xs },
        { id: 'cab', kind: 'cable', from: 'gen', length: len, resistancePerKm: rkm, reactancePerKm: xkm },
        {
          id: 'tx',
          kind: 'transformer',
          from: 'cab',
          ratedApparentPower: tx.sr,
          primaryVoltage: tx.vp,
          secondaryVoltage: tx.vs,
          noLoadLoss: tx.nl,
          loadLoss: tx.ll,
          impedancePercent: tx.zPct,
        },
        { id: 'ld', kind: 'ac-load', from: 'tx', power: 200_000, powerFactor: 0.9 },
      ]),
    );
    const ld = el(result, 'ld');
    const zl = loadImpedance(ld);
    const rc = (rkm * len) / 1000;
    const xc = (xkm * len) / 1000;
    const n = tx.vs / tx.vp;
    // Transformer, as the engine documents its model (core/model/project.ts, TransformerStage): an ideal ratio
    // n = V_sec/V_pri, then the short-circuit impedance referred to the secondary on the base
    // Z_b = V_sec,LL²/S_rated with R% = 100·P_load/S_rated and X% = √(Z%² − R%²) (the usual
    // percent-impedance relations, e.g. any transformer handbook), per phase of a star equivalent.
    const zb = (tx.vs * tx.vs) / tx.sr;
    const rPct = (100 * tx.ll) / tx.sr;
    const xPct = Math.sqrt(tx.zPct ** 2 - rPct ** 2);
    const rt = (rPct / 100) * zb;
    const xt = (xPct / 100) * zb;
    // The ideal ratio in SPICE: per phase a voltage-controlled voltage source E (secondary = n × primary)
    // and a current-controlled current source F (primary draws n × secondary current), star-star.
    // The constant no-load loss is drawn at the primary terminals: modelled as a shunt resistor per phase
    // taking P_nl/3 at the engine's solved primary voltage, R = |V_pri,phase|²/(P_nl/3).
    const vPri = el(result, 'tx').input!.phasor!.voltage;
    const rNl = (vPri.re ** 2 + vPri.im ** 2) / (tx.nl / 3);
    const vPh = tx.vp / Math.sqrt(3);
    const lines: string[] = [];
    for (const [ph, deg] of [
      ['a', 0],
      ['b', -120],
      ['c', 120],
    ] as const) {
      lines.push(`V${ph} e${ph} 0 AC ${sp(vPh)} ${deg}`);
      lines.push(seriesBranch(`g${ph}`, `e${ph}`, `t${ph}`, rs, xs, f)); // generator internal impedance
      lines.push(seriesBranch(`c${ph}`, `t${ph}`, `p${ph}`, rc, xc, f)); // cable conductor
      lines.push(`Rnl${ph} p${ph} 0 ${sp(rNl)}`); // core loss at the primary
      lines.push(`F${ph} p${ph} 0 Vsense${ph} ${sp(n)}`); // primary current = n × secondary current
      lines.push(`E${ph} x${ph} 0 p${ph} 0 ${sp(n)}`); // secondary EMF = n × primary voltage
      lines.push(`Vsense${ph} x${ph} y${ph} 0`); // ammeter in the secondary
      lines.push(seriesBranch(`w${ph}`, `y${ph}`, `q${ph}`, rt, xt, f)); // winding impedance, secondary side
      lines.push(seriesBranch(`z${ph}`, `q${ph}`, 'ln', zl.r, zl.x, f)); // load
    }
    lines.push('Rn ln 0 1e-3'); // load star point to the secondary star point
    const s = runAc(lines.join('\n'), f, [
      'v(qa,ln)',
      'v(qa,qb)',
      'v(pa)',
      'v(ta)',
      'i(Va)',
      'i(Vb)',
      'i(Vc)',
      'i(Vsensea)',
      'i(Vsenseb)',
      'i(Vsensec)',
      'v(pb)',
      'v(pc)',
      'v(ta,pa)',
      'v(tb,pb)',
      'v(tc,pc)',
      'v(ya,qa)',
      'v(yb,qb)',
      'v(yc,qc)',
    ]);
    const ia = cneg(s['i(Va)']!);
    const ib = cneg(s['i(Vb)']!);
    const ic = cneg(s['i(Vc)']!);
    const isec = s['i(Vsensea)']!;
    const emf = (deg: number): Phasor => ({ re: vPh * Math.cos((deg * Math.PI) / 180), im: vPh * Math.sin((deg * Math.PI) / 180) });
    const sEmf = csum(power(emf(0), ia), power(emf(-120), ib), power(emf(120), ic));
    const sTerm = { re: 3 * power(s['v(ta)']!, ia).re, im: 3 * power(s['v(ta)']!, ia).im }; // balanced: 3 × phase a
    const pCable = power(s['v(ta,pa)']!, ia).re + power(s['v(tb,pb)']!, ib).re + power(s['v(tc,pc)']!, ic).re;
    const pWindings =
      power(s['v(ya,qa)']!, isec).re + power(s['v(yb,qb)']!, s['i(Vsenseb)']!).re + power(s['v(yc,qc)']!, s['i(Vsensec)']!).re;
    const pCore = (cabs(s['v(pa)']!) ** 2 + cabs(s['v(pb)']!) ** 2 + cabs(s['v(pc)']!) ** 2) / rNl;

    const ag = new Agreement('(c) 3φ generator Z + cable + transformer + load');
    const vE = ld.input!.phasor!.voltage;
    ag.rel('load phase voltage |V|', cabs(vE), cabs(s['v(qa,ln)']!));
    ag.rel('load line voltage |V_ab| (engine LL)', ld.input!.voltage, cabs(s['v(qa,qb)']!));
    ag.angle('load voltage angle, phase a', cargDeg(vE), cargDeg(s['v(qa,ln)']!));
    ag.rel('secondary line current', ld.input!.current, cabs(isec));
    ag.rel('primary line current', el(result, 'cab').input!.current, cabs(ia));
    ag.rel('transformer primary phase voltage |V|', cabs(vPri), cabs(s['v(pa)']!));
    ag.angle('transformer primary voltage angle', cargDeg(vPri), cargDeg(s['v(pa)']!));
    ag.rel('generator terminal line voltage', el(result, 'gen').output!.voltage, cabs(s['v(ta)']!) * Math.sqrt(3));
    ag.rel('source EMF P (3 phases)', result.totals.sourcePower, sEmf.re);
    ag.rel('source terminal P', el(result, 'gen').output!.p, sTerm.re);
    ag.rel('source terminal Q', el(result, 'gen').output!.q, sTerm.im);
    ag.rel('generator internal loss', el(result, 'gen').loss, sEmf.re - sTerm.re);
    ag.rel('cable I²R loss (3 conductors)', el(result, 'cab').loss, pCable);
    ag.rel('transformer loss (core + 3 windings)', el(result, 'tx').loss, pCore + pWindings);
    summary.push(ag);
  });
});
