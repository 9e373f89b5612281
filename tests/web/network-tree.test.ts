/**
 * The circuit editor's pure helpers (web/components/fields/network-tree.ts): the network of the file
 * read as a tree and written back unchanged (nested cases, a lone part, the networks the app itself
 * writes: the form's default, the added load's template, the power-factor bank; random networks of
 * the property tests' generator); the tree changed by the editor's operations; parts named by their
 * place; values typed in the user's number format read into the engine's text and shown back.
 *
 * Expected values: the networks are the page's own (round trips compare with themselves); the
 * impedance of 12 Ω in series with (40 mH ∥ 100 µF) at 50 Hz is worked by hand beside its test
 * (Z_L = jωL, Z_C = 1/(jωC), parallel 1/ΣY: steady-state phasor analysis); the SI prefixes are the SI
 * Brochure's (9th ed., Table 7); number formats are the locales' own (Intl, CLDR). Naming and
 * behaviour checks: common practice (no source).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  addGroup,
  addPart,
  countParts,
  exampleValue,
  figureWords,
  filePath,
  moveNode,
  networkToTree,
  nodeName,
  readPartValue,
  removeNode,
  setJoin,
  setKind,
  treeToNetwork,
  valueForInput,
  valueMessage,
  whyNotRemove,
  type CircuitTree,
  type PartKind,
} from '../../web/components/fields/network-tree.ts';
import { networkImpedance, parseNetwork } from '../../core/physics/network.ts';
import { parseSiValue } from '../../core/physics/si-prefix.ts';
import { demoProjects } from '../../core/demos/index.ts';
import { KIND_FORMS } from '../../web/editor/fields.ts';
import { templateFor } from '../../web/editor/templates.ts';
import { projectWithNetworksArb } from '../core/arbitraries.ts';

const UNITS = { resistor: 'Ω', inductor: 'H', capacitor: 'F' } as const;

/** 12 Ω in series with (40 mH ∥ 100 µF): the file format's own example (core/model/circuit-network.ts). */
const R_SERIES_LC = { series: [{ resistor: '12 Ω' }, { parallel: [{ inductor: '40 mH' }, { capacitor: '100 µF' }] }] };

/** Networks the app and its files hold, each with where it comes from. */
function knownNetworks(): [string, unknown][] {
  const out: [string, unknown][] = [];
  for (const demo of demoProjects) {
    for (const e of demo.project.elements) if (e.kind === 'network-load') out.push([`demo ${demo.id}, ${e.id}`, e.network]);
  }
  const form = KIND_FORMS['network-load']!.fields.find((f) => f.type === 'network');
  out.push(['the form default', (form as { default: unknown }).default]);
  const template = templateFor('network-load', { port: { kind: 'ac1', voltage: 230, frequency: 50 } });
  if (template) out.push(['the added load', template['network']]);
  out.push(['a power-factor bank (core/studies/pf/correction.ts)', { capacitor: 3.2e-5 }]);
  out.push(['the file format example', R_SERIES_LC]);
  out.push(['three levels', { parallel: [{ series: [{ resistor: 5 }, { parallel: [{ inductor: '1 mH' }, { series: [{ capacitor: '1 µF' }, { resistor: '1 kΩ' }] }] }] }, { capacitor: '47n' }] }]);
  out.push(['a group of one', { series: [{ parallel: [{ resistor: '10k' }] }] }]);
  return out;
}

describe('the file’s network as a tree and back', () => {
  it.each(knownNetworks())('%s round-trips unchanged', (_label, network) => {
    const tree = networkToTree(network);
    expect(tree).toBeDefined();
    expect(treeToNetwork(tree!)).toEqual(network);
  });

  it('the app’s own networks are there to check (template, form default, bank)', () => {
    expect(knownNetworks().filter(([l]) => l === 'the added load' || l === 'the form default').length).toBe(2);
  });

  it('random networks of the property generator round-trip (fixed seed)', () => {
    const projects = fc.sample(projectWithNetworksArb, { seed: 18, numRuns: 40 });
    const networks = projects.flatMap((p) => p.elements.filter((e) => e.kind === 'network-load').map((e) => (e as { network: unknown }).network));
    expect(networks.length).toBeGreaterThan(10);
    for (const n of networks) expect(treeToNetwork(networkToTree(n)!)).toEqual(n);
  });

  it('a lone part is a tree of one, written back alone until a second part joins it', () => {
    const tree = networkToTree({ capacitor: '220 µF' })!;
    expect(tree.bare).toBe(true);
    expect(filePath(tree, [0])).toBe('capacitor');
    const two = addPart(tree, []).tree;
    expect(treeToNetwork(two)).toEqual({ series: [{ capacitor: '220 µF' }, { resistor: '10 Ω' }] });
    expect(filePath(networkToTree(treeToNetwork(two))!, [1])).toBe('series.1.resistor');
  });

  it('shapes a tree cannot show are left to the text view', () => {
    for (const bad of [undefined, null, 5, [], {}, { resistor: 1, inductor: 1 }, { wire: 1 }, { series: 'x' }, { series: [{ diode: 1 }] }]) {
      expect(networkToTree(bad)).toBeUndefined();
    }
    // An empty group is shown (the engine's message goes to it), so it can be filled.
    expect(networkToTree({ series: [] })?.root.items).toEqual([]);
  });

  it('file paths of nested parts and groups are the engine’s problem paths', () => {
    const tree = networkToTree(R_SERIES_LC)!;
    expect(filePath(tree, [0])).toBe('series.0.resistor');
    expect(filePath(tree, [1])).toBe('series.1.parallel');
    expect(filePath(tree, [1, 1])).toBe('series.1.parallel.1.capacitor');
    // The engine names the same path for a bad capacitor there.
    const broken = { series: [{ resistor: '12 Ω' }, { parallel: [{ inductor: '40 mH' }, { capacitor: '-1 µF' }] }] };
    const parsed = parseNetwork(broken);
    expect(parsed.ok).toBe(false);
    if (!parsed.ok) expect(parsed.issues.map((i) => i.path.join('.'))).toEqual([filePath(networkToTree(broken)!, [1, 1])]);
  });
});

describe('changing the tree', () => {
  it('builds 12 Ω + (40 mH ∥ 100 µF) from the added load by the editor’s operations, and the engine reads it', () => {
    let tree: CircuitTree = networkToTree({ series: [{ resistor: '50 Ω' }, { inductor: '50 mH' }] })!;
    tree = removeNode(tree, [1]);
    expect(whyNotRemove(tree, [0])).toBe('A circuit needs at least one part');
    const g = addGroup(tree, []);
    expect(g.path).toEqual([1]);
    tree = g.tree;
    expect(treeToNetwork(tree)).toEqual({ series: [{ resistor: '50 Ω' }, { parallel: [{ resistor: '10 Ω' }] }] });
    expect(whyNotRemove(tree, [1, 0])).toBe('The only entry of parallel group 2: remove the group instead');
    tree = setKind(tree, [1, 0], 'inductor');
    tree = addPart(tree, [1]).tree;
    tree = setKind(tree, [1, 1], 'capacitor');
    // Values as setField writes them (the engine's text).
    const network = JSON.parse(JSON.stringify(treeToNetwork(tree)).replace('"50 Ω"', '"12 Ω"').replace('"10 mH"', '"40 mH"'));
    expect(network).toEqual(R_SERIES_LC);
    // Worked by hand at 50 Hz: ω = 100π; X_L = ωL = 4π = 12.566 Ω, X_C = 1/(ωC) = 100/π = 31.831 Ω;
    // L ∥ C = j·X_L·X_C/(X_C − X_L) = j·(L/C)/(X_C − X_L) = j·400/19.2646 = j20.7635 Ω; Z = 12 + j20.7635 Ω.
    const parsed = parseNetwork(network);
    expect(parsed.ok).toBe(true);
    const xl = 100 * Math.PI * 0.04;
    const xc = 1 / (100 * Math.PI * 100e-6);
    const z = parsed.ok ? networkImpedance(parsed.network, 50) : { re: NaN, im: NaN };
    expect(z.re).toBeCloseTo(12, 12);
    expect(z.im).toBeCloseTo((xl * xc) / (xc - xl), 10);
    expect(z.im).toBeCloseTo(20.7635, 4);
  });

  it('moves within a group, switches a group, and keeps the rest as it was', () => {
    const tree = networkToTree(R_SERIES_LC)!;
    const down = moveNode(tree, [0], 1);
    expect(down.path).toEqual([1]);
    expect(treeToNetwork(down.tree)).toEqual({ series: [R_SERIES_LC.series[1], R_SERIES_LC.series[0]] });
    expect(moveNode(tree, [1], 1).tree).toBe(tree); // the last stays last
    expect(moveNode(tree, [0], -1).tree).toBe(tree);
    const inner = moveNode(tree, [1, 1], -1);
    expect(treeToNetwork(inner.tree)).toEqual({ series: [{ resistor: '12 Ω' }, { parallel: [{ capacitor: '100 µF' }, { inductor: '40 mH' }] }] });
    expect(treeToNetwork(setJoin(tree, [1], 'series'))).toEqual({ series: [{ resistor: '12 Ω' }, { series: [{ inductor: '40 mH' }, { capacitor: '100 µF' }] }] });
    expect(treeToNetwork(tree)).toEqual(R_SERIES_LC); // unchanged
    expect(countParts(tree.root)).toBe(3);
    // A group nested in a group nested in the circuit: any depth.
    let deep = tree;
    let at: number[] = [1];
    for (let i = 0; i < 5; i++) {
      const g = addGroup(deep, at);
      deep = g.tree;
      at = [...g.path];
    }
    expect(at).toHaveLength(6);
    expect(parseNetwork(treeToNetwork(deep)).ok).toBe(true);
    expect(treeToNetwork(removeNode(deep, [1, 2]))).toEqual(R_SERIES_LC);
  });

  it('names each part by its place, as a screen reader reads it', () => {
    const tree = networkToTree(R_SERIES_LC)!;
    expect(nodeName(tree, [0])).toBe('Resistor 1 of the circuit');
    expect(nodeName(tree, [1])).toBe('Parallel group 2');
    expect(nodeName(tree, [1, 0])).toBe('Inductor 1 of parallel group 2');
    expect(nodeName(tree, [1, 1])).toBe('Capacitor 2 of parallel group 2');
    const deeper = addGroup(tree, [1]);
    expect(nodeName(deeper.tree, [1, 2, 0])).toBe('Resistor 1 of series group 2.3');
  });
});

describe('values in the user’s number format', () => {
  const cases: [string, string, PartKind, unknown][] = [
    // [locale, typed, kind, stored]
    ['de-DE', '4,7 mH', 'inductor', '4.7 mH'],
    ['de-DE', '1.000 Ω', 'resistor', '1000 Ω'],
    ['de-DE', '0,5', 'resistor', 0.5],
    ['de-DE', '220 µF', 'capacitor', '220 µF'],
    ['en-US', '4.7 mH', 'inductor', '4.7 mH'],
    ['en-US', '1,200 Ω', 'resistor', '1200 Ω'],
    ['en-US', '10k', 'resistor', '10 k'],
    ['en-US', '47n', 'capacitor', '47 n'],
    ['fr-FR', '4,7 mH', 'inductor', '4.7 mH'],
    ['fr-FR', '1\u202f000 µF', 'capacitor', '1000 µF'],
    ['en-US', '-5 Ω', 'resistor', '-5 Ω'],
  ];
  it.each(cases)('%s: "%s" (%s) is stored as %j', (locale, typed, kind, stored) => {
    expect(readPartValue(typed, kind, locale)).toEqual({ ok: true, value: stored });
  });

  it('the stored text reads in the engine as the SI value typed (SI Brochure, Table 7: m = 1e-3, µ = 1e-6, k = 1e3)', () => {
    const si = (typed: string, kind: PartKind, locale: string) => {
      const r = readPartValue(typed, kind, locale);
      if (!r.ok) throw new Error(r.problem);
      const p = parseSiValue(r.value, UNITS[kind]);
      if (!p.ok) throw new Error(p.message);
      return p.value;
    };
    expect(si('4,7 mH', 'inductor', 'de-DE')).toBeCloseTo(4.7e-3, 15);
    expect(si('2,2 kΩ', 'resistor', 'de-DE')).toBeCloseTo(2200, 9);
    expect(si('1.5 µF', 'capacitor', 'en-US')).toBeCloseTo(1.5e-6, 18);
  });

  it('refuses what is not a number in the user’s format, with the problem in words', () => {
    expect(readPartValue('', 'resistor', 'en-US')).toEqual({ ok: false, problem: 'is empty: enter a value, e.g. 1.2 kΩ' });
    expect(readPartValue('  ', 'inductor', 'de-DE')).toEqual({ ok: false, problem: 'is empty: enter a value, e.g. 4,7 mH' });
    expect(readPartValue('abc', 'capacitor', 'en-US')).toEqual({ ok: false, problem: '"abc" does not start with a number: write e.g. 220 µF' });
    // In de-DE a point groups thousands: "4.7" is neither 4.7 nor 47 (web/format/parse.ts rules).
    const dot = readPartValue('4.7 mH', 'inductor', 'de-DE');
    expect(dot.ok).toBe(false);
    if (!dot.ok) expect(dot.problem).toMatch(/^"4\.7" is not a number in this number format/);
    expect(exampleValue('resistor', 'de-DE')).toBe('1,2 kΩ');
  });

  it('what the engine says of a bad prefix quotes what the user typed, in their number format', () => {
    const r = readPartValue('4,7 mQ', 'resistor', 'de-DE');
    expect(r).toEqual({ ok: true, value: '4.7 mQ' });
    const engine = parseSiValue('4.7 mQ', 'Ω');
    expect(engine.ok).toBe(false);
    if (!engine.ok) {
      const shown = valueMessage(engine.message, '4.7 mQ', '4,7 mQ', 'de-DE');
      expect(shown).toContain('"4,7 mQ"');
      expect(shown).toContain('"1,2 kΩ"');
      expect(shown).not.toContain('4.7');
    }
  });

  it('stored values are shown in the user’s format: text keeps its prefix, a bare number gets one', () => {
    expect(valueForInput('4.7 mH', 'inductor', 'de-DE')).toBe('4,7 mH');
    expect(valueForInput('220 µF', 'capacitor', 'de-DE')).toBe('220 µF');
    expect(valueForInput(0.0047, 'inductor', 'de-DE')).toBe('4,7 mH');
    expect(valueForInput(3.2e-5, 'capacitor', 'en-US')).toBe('32 µF');
    expect(valueForInput(1200, 'resistor', 'en-US')).toBe('1.2 kΩ');
    expect(valueForInput(5, 'resistor', 'en-US')).toBe('5 Ω');
    expect(valueForInput('10k', 'resistor', 'en-US')).toBe('10k');
    expect(valueForInput('4k7', 'resistor', 'en-US')).toBe('4k7'); // shown as stored; the engine's message says why it is refused
    expect(valueForInput({}, 'resistor', 'en-US')).toBe('');
  });

  it('shown and read back, a value keeps its SI value (de-DE, en-US, fr-FR)', () => {
    const stored: [unknown, PartKind][] = [['4.7 mH', 'inductor'], [0.0047, 'inductor'], ['220 µF', 'capacitor'], [1.5e-7, 'capacitor'], ['12 Ω', 'resistor'], [1234.5, 'resistor'], ['10k', 'resistor']];
    for (const locale of ['de-DE', 'en-US', 'fr-FR']) {
      for (const [value, kind] of stored) {
        const back = readPartValue(valueForInput(value, kind, locale), kind, locale);
        expect(back.ok, `${String(value)} in ${locale}`).toBe(true);
        const a = parseSiValue(value, UNITS[kind]);
        const b = back.ok ? parseSiValue(back.value, UNITS[kind]) : a;
        expect(a.ok && b.ok).toBe(true);
        if (a.ok && b.ok) expect(b.value / a.value).toBeCloseTo(1, 12);
      }
    }
  });
});

describe('the circuit’s figures in words', () => {
  it('R + jX with one prefix, |Z|, power factor and power (en-US, de-DE)', () => {
    const f = { frequency: 50, impedance: { r: 12, x: 20.7633, magnitude: 23.98 }, p: 1103.7, powerFactor: 0.5004, pfSense: 'lagging' as const };
    const w = figureWords(f, 'en-US');
    expect(w.z).toBe('12 + j20.76\u202fΩ');
    expect(w.magnitude).toBe('23.98\u202fΩ');
    expect(w.pf).toBe('0.500 lagging');
    expect(w.power).toBe('1.104\u202fkW');
    expect(figureWords({ ...f, impedance: { r: 1500, x: -2500, magnitude: 2915.5 } }, 'de-DE').z).toBe('1,5 − j2,5\u202fkΩ');
    expect(figureWords({ ...f, impedance: { r: Infinity, x: 0, magnitude: Infinity } }, 'en-US').open).toBe(true);
  });
});
