/**
 * Loads given by their current against ngspice (AC analysis).
 *
 * Method: solve with the engine; put each constant-current load into SPICE as an AC current source
 * carrying the engine's solved current phasor (magnitude as given by the user, angle from the
 * engine), each constant-power load as the impedance that draws its solved power at its solved
 * voltage (Z = |V|²/conj(S_phase), as tests/reference/ngspice.test.ts does). SPICE then finds the
 * voltages on its own. If the engine's operating point is right, SPICE reproduces the load voltage
 * (magnitude and angle), the source powers and the cable loss; and the angle between SPICE's load
 * voltage and the current source equals the load's power factor angle (arccos pf, lagging: the
 * current behind the voltage), which the engine had to find by itself. Tolerances as ngspice.test.ts:
 * 0.1 %, 0.01°.
 */
import { describe, expect, it } from 'vitest';
import { solveProject, type ElementResult, type Project, type SolveResult } from '../../core/index.ts';
import { requireNgspice, runAc, seriesBranch, sp } from './ngspice.ts';
import { cabs, cargDeg, cneg, power } from './phasor.ts';
import { Agreement, agreementSummary, projectOf } from './agreement.ts';

function solveOk(project: Project): SolveResult {
  const out = solveProject(project);
  if (!out.ok) throw new Error(`engine refused the case: ${JSON.stringify(out.problems)}`);
  return out.result;
}

const el = (result: SolveResult, id: string): ElementResult => result.elements.find((x) => x.id === id)!;

/** Per-phase equivalent impedance of a solved constant-power load: Z = |V|²/conj(S_phase). */
function loadImpedance(load: ElementResult): { r: number; x: number } {
  const port = load.input!;
  const m = port.kind === 'ac3' ? 3 : 1;
  const v = port.phasor!.voltage;
  const v2 = v.re * v.re + v.im * v.im;
  const p = port.p / m;
  const q = port.q / m;
  const d = p * p + q * q;
  return { r: (v2 * p) / d, x: (v2 * q) / d };
}

/** A SPICE AC current source from node a to node b (the current leaves a through the source: a load). */
const currentSource = (name: string, a: string, b: string, i: { re: number; im: number }) => `I${name} ${a} ${b} AC ${sp(cabs(i))} ${sp(cargDeg(i))}`;

const summary = agreementSummary('Current loads, engine vs ngspice');

const project = projectOf;

describe('constant-current loads against ngspice', () => {
  it('ngspice is installed (otherwise: apt-get install -y ngspice)', () => {
    expect(requireNgspice()).toBeTruthy();
  });

  it('single-phase: source impedance, a cable to a 20 A pf 0.8 lagging current load beside a 2 kW pf 0.9 power load', () => {
    const f = 50;
    const len = 40;
    const rkm = 4.61; // Ω/km, one conductor (about 4 mm² copper; from memory)
    const xkm = 0.1;
    const [rs, xs] = [0.08, 0.2];
    const result = solveOk(
      project('1φ current load', [
        { id: 'sup', kind: 'grid', phases: 1, voltage: 230, frequency: f, resistance: rs, reactance: xs },
        { id: 'cab', kind: 'cable', from: 'sup', length: len, resistancePerKm: rkm, reactancePerKm: xkm },
        { id: 'cc', kind: 'ac-current-load', from: 'cab', current: 20, powerFactor: 0.8 },
        { id: 'pl', kind: 'ac-load', from: 'cab', power: 2000, powerFactor: 0.9 },
      ]),
    );
    const cc = el(result, 'cc');
    const zl = loadImpedance(el(result, 'pl'));
    const rc = (rkm * len) / 1000;
    const xc = (xkm * len) / 1000;
    const netlist = [
      `Vsup e 0 AC ${sp(230)} 0`,
      seriesBranch('src', 'e', 't', rs, xs, f),
      seriesBranch('go', 't', 'a', rc, xc, f),
      currentSource('cc', 'a', 'n', cc.input!.phasor!.current),
      seriesBranch('pl', 'a', 'n', zl.r, zl.x, f),
      seriesBranch('ret', 'n', '0', rc, xc, f),
    ].join('\n');
    const s = runAc(netlist, f, ['v(a,n)', 'i(Vsup)', 'v(t)', 'v(t,a)', 'v(n)']);
    const i = cneg(s['i(Vsup)']!);
    const vLoad = s['v(a,n)']!;
    const sEmf = power({ re: 230, im: 0 }, i);
    const sTerm = power(s['v(t)']!, i);
    const pCable = power(s['v(t,a)']!, i).re + power(s['v(n)']!, i).re;

    const ag = new Agreement('1φ source Z + cable + current load + power load');
    ag.rel('load voltage |V|', cc.input!.voltage, cabs(vLoad));
    ag.angle('load voltage angle', cargDeg(cc.input!.phasor!.voltage), cargDeg(vLoad));
    // The user's figures: 20 A (given to SPICE as it is) at pf 0.8 lagging, i.e. the current
    // arccos 0.8 = 36.87° behind SPICE's own load voltage.
    expect(Math.abs(cabs(cc.input!.phasor!.current) - 20)).toBeLessThanOrEqual(1e-9 * 20);
    ag.angle('current behind the load voltage (arccos 0.8)', cargDeg(vLoad) - cargDeg(cc.input!.phasor!.current), (Math.acos(0.8) * 180) / Math.PI);
    ag.rel('line current', el(result, 'cab').input!.current, cabs(i));
    ag.rel('source EMF P', result.totals.sourcePower, sEmf.re);
    ag.rel('source terminal Q', el(result, 'sup').output!.q, sTerm.im);
    ag.rel('cable I²R loss', el(result, 'cab').loss, pCable);
    ag.rel('current load P = |V|·I·pf', cc.pIn, cabs(vLoad) * 20 * 0.8);
    summary.push(ag);
  });

  it('three-phase 4-wire: 400 V star source, 120 m cable, a 60 A pf 0.85 leading current load in star', () => {
    const f = 50;
    const len = 120;
    const rkm = 0.524; // Ω/km, one conductor (about 35 mm² copper; from memory)
    const xkm = 0.08;
    const result = solveOk(
      project('3φ current load', [
        { id: 'sup', kind: 'grid', phases: 3, voltage: 400, frequency: f },
        { id: 'cab', kind: 'cable', from: 'sup', length: len, resistancePerKm: rkm, reactancePerKm: xkm },
        { id: 'cc', kind: 'ac-current-load', from: 'cab', current: 60, powerFactor: 0.85, pfSense: 'leading' },
      ]),
    );
    const cc = el(result, 'cc');
    const rc = (rkm * len) / 1000;
    const xc = (xkm * len) / 1000;
    const vph = 400 / Math.sqrt(3);
    const i0 = cc.input!.phasor!.current;
    // Balanced: phases b and c are phase a turned by −120° and +120° (source and current alike).
    const turn = (p: { re: number; im: number }, deg: number) => {
      const t = (deg * Math.PI) / 180;
      return { re: p.re * Math.cos(t) - p.im * Math.sin(t), im: p.re * Math.sin(t) + p.im * Math.cos(t) };
    };
    const lines: string[] = [];
    (['a', 'b', 'c'] as const).forEach((ph, k) => {
      const deg = [0, -120, 120][k]!;
      lines.push(`V${ph} e${ph} 0 AC ${sp(vph)} ${deg}`);
      lines.push(seriesBranch(`l${ph}`, `e${ph}`, `r${ph}`, rc, xc, f));
      lines.push(currentSource(`cc${ph}`, `r${ph}`, 'n', turn(i0, deg)));
    });
    lines.push('Rn n 0 1e-6'); // star point to the source neutral (no neutral current when balanced)
    const s = runAc(lines.join('\n'), f, ['v(ra,n)', 'i(Va)', 'v(ea,ra)']);
    const vLoad = s['v(ra,n)']!;
    const ia = cneg(s['i(Va)']!);
    const sSrc = power({ re: vph, im: 0 }, ia);

    const ag = new Agreement('3φ cable + leading current load');
    ag.rel('load voltage |V| line-to-line', cc.input!.voltage, cabs(vLoad) * Math.sqrt(3));
    ag.angle('load voltage angle (phase a)', cargDeg(cc.input!.phasor!.voltage), cargDeg(vLoad));
    // Leading: the current arccos 0.85 = 31.79° ahead of SPICE's own load voltage.
    ag.angle('current ahead of the load voltage (arccos 0.85)', cargDeg(i0) - cargDeg(vLoad), (Math.acos(0.85) * 180) / Math.PI);
    ag.rel('source P (three phases)', result.totals.sourcePower, 3 * sSrc.re);
    ag.rel('source Q (three phases)', el(result, 'sup').output!.q, 3 * sSrc.im);
    ag.rel('cable I²R loss', el(result, 'cab').loss, 3 * power(s['v(ea,ra)']!, ia).re);
    summary.push(ag);
  });
});
