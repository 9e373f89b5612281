/**
 * Every message the engine can produce is in the user's words (issue 17, point 3; owner's rules):
 * elements by the name users gave them (never an id that is not also the name), fields by their
 * form label (never a file-format field name such as ratedVoltage), numbers with sensible digits
 * (never an unformatted float such as 0.0416666666666667).
 *
 * (a) A static walk over core/ source: every string literal and template text passed as a message
 *     (a `message:` property, a `warn`/`push` of text, a thrown Error) is read for camelCase schema
 *     keys, and every template that interpolates an element's `id` inside quotes where its name
 *     belongs (`"${e.id}"`) is named.
 * (b) A dynamic walk: validation, solve and every study (backup, surge/starting/faults, machines,
 *     pump duty, power-factor correction, conductor sizing through the solve, economics) over the
 *     demos and a corpus of broken variants (each element's fields set out of range, missing, of the
 *     wrong type; study settings broken; the triggers of warnings), collecting every problem
 *     message, its one-line form (formatProblem, as the CLI prints it) and every warning.
 */
import { readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parse } from '@babel/parser';
import { describe, expect, it } from 'vitest';
import { CAMEL_KEYS, CAMEL_RE } from '../tools/schema-keys.ts';
import { demoProjects } from '../../core/demos/index.ts';
import { solveProject, type Solved } from '../../core/solve/index.ts';
import { formatProblem, type Problem } from '../../core/model/errors.ts';
import { studySurges } from '../../core/studies/surge/index.ts';
import { runBackupStudy } from '../../core/studies/backup/study.ts';
import { machineDetails } from '../../core/studies/machines/details.ts';
import { projectPumpDuty } from '../../core/studies/machines/pump-duty.ts';
import { correctPowerFactor } from '../../core/studies/pf/correction.ts';
import { lossCostPerYear, pumpDutyCosts } from '../../core/studies/economics.ts';
import { lifetimeCost } from '../../core/studies/lifetime.ts';
import { batteryBenchProject } from '../battery/fixtures.ts';
import { figure, q, say, sigText, valueText } from '../../core/model/message.ts';

const repoRoot = fileURLToPath(new URL('../..', import.meta.url));

// ---------- what must not reach users ----------


/**
 * A number printed with more digits than a reader uses: a decimal with more than 4 significant
 * digits (0.0416666666666667, 1234.5) or a whole number of 7 digits or more (1000000 instead of 1 M).
 * Years, standard numbers and clause numbers are short enough to pass.
 */
function longNumber(text: string): string | undefined {
  for (const m of text.matchAll(/(?<![\w.])\d+(?:\.\d+)?(?:e[+-]?\d+)?(?![\w.]|\.\d)/gi)) {
    const mantissa = m[0].replace(/e.*$/i, '');
    if (/e/i.test(m[0])) return m[0];
    if (mantissa.includes('.')) {
      const digits = mantissa.replace('.', '').replace(/^0+/, '');
      if (digits.length > 4) return m[0];
    } else if (mantissa.length >= 7) return m[0];
  }
  return undefined;
}

interface Said {
  where: string;
  text: string;
  /** id → name of the project the text was said about (ids that are not also names must not appear). */
  names: ReadonlyMap<string, string>;
}

/** What is wrong with one message (undefined when nothing). */
function offence(s: Said): string | undefined {
  const key = s.text.match(CAMEL_RE);
  if (key) return `file-format field name "${key[1]}"`;
  for (const [id, name] of s.names) {
    // A choice's value in a list of them ("must be "dol", … or "drive"") is not the element.
    const quoted = s.text.replace(/"[^"]*"(?=,| or )|(?<=, | or )"[^"]*"/g, '');
    if (id !== name && quoted.includes(`"${id}"`)) return `element id "${id}" where its name "${name}" belongs`;
  }
  const n = longNumber(s.text);
  if (n) return `unformatted number ${n}`;
  return undefined;
}

// ---------- (b) the dynamic walk ----------

type Json = Record<string, unknown>;
type ProjectJson = { elements: Json[]; [k: string]: unknown };

function namesOf(project: unknown): Map<string, string> {
  const out = new Map<string, string>();
  const els = (project as ProjectJson).elements;
  if (Array.isArray(els)) for (const e of els) if (e && typeof e['id'] === 'string' && typeof e['name'] === 'string') out.set(e['id'], e['name']);
  return out;
}

const said: Said[] = [];
let solvedCount = 0;
let refusedCount = 0;

function sayProblems(where: string, problems: readonly Problem[], names: ReadonlyMap<string, string>, project: unknown): void {
  for (const p of problems) {
    said.push({ where: `${where} problem ${p.code} at ${p.elementId || 'project'}.${p.field}`, text: p.message, names });
    said.push({ where: `${where} CLI line`, text: formatProblem(p, project), names });
  }
}

function sayWarnings(where: string, value: unknown, names: ReadonlyMap<string, string>): void {
  const walk = (v: unknown, path: string): void => {
    if (Array.isArray(v)) return v.forEach((x, i) => walk(x, `${path}[${i}]`));
    if (typeof v !== 'object' || v === null) return;
    for (const [k, x] of Object.entries(v)) {
      if (/^(warnings|cautions|notes|refusals|problems)$/.test(k) && Array.isArray(x)) {
        for (const w of x) {
          if (typeof w === 'string') said.push({ where: `${where} ${path}.${k}`, text: w, names });
          else if (w && typeof w === 'object' && typeof (w as Json)['message'] === 'string') said.push({ where: `${where} ${path}.${k}`, text: (w as Json)['message'] as string, names });
        }
      } else if (k === 'note' && typeof x === 'string') said.push({ where: `${where} ${path}.note`, text: x, names });
      else if (k !== 'resultBefore' && k !== 'resultAfter' && k !== 'correctedProject' && k !== 'project') walk(x, `${path}.${k}`);
    }
  };
  walk(value, '');
}

/** Each study of a solved project: its refusals and warnings. */
function studies(where: string, s: Solved & { ok: true }, names: ReadonlyMap<string, string>): void {
  const outcomes: [string, () => unknown][] = [
    ['surge', () => studySurges(s)],
    ['machines', () => machineDetails(s)],
    ['pump duty', () => projectPumpDuty(s)],
    ['loss cost', () => lossCostPerYear(s.result, { pricePerKWh: 0.2, hoursPerYear: 8760 })],
    ['loss cost, bad settings', () => lossCostPerYear(s.result, { pricePerKWh: -1, hoursPerYear: 9000 })],
    ['cost over the years', () => lifetimeCost(s, { dayPricePerKWh: 0.3, nightPricePerKWh: 0.1, dayStartHour: 7, dayEndHour: 23, hoursPerYear: 8760, years: 10, discountRate: 0.05, gridCo2KgPerKWh: 0.4, generator: { quarterLoadLitresPerHour: 2, halfLoadLitresPerHour: 3, fullLoadLitresPerHour: 5, ratedPower: 1000, outageHoursPerYear: 20, outagesPerYear: 3 } }, { energyWh: 2000, timeSeconds: 7200 })],
    ['cost over the years, bad settings', () => lifetimeCost(s, { dayPricePerKWh: -1, hoursPerYear: 9000, years: 0.5, discountRate: 2, dayStartHour: 20, dayEndHour: 4, generator: { quarterLoadLitresPerHour: 3, halfLoadLitresPerHour: 2, fullLoadLitresPerHour: 1, outageHoursPerYear: -1 } })],
  ];
  const p = s.project as unknown as ProjectJson;
  if (p['backup'] !== undefined) outcomes.push(['backup', () => runBackupStudy(s)]);
  for (const e of s.result.elements) {
    if (e.input && e.input.kind !== 'dc' && e.input.kind !== 'shaft') {
      outcomes.push([`pf correction at ${e.id}`, () => correctPowerFactor(s, { at: e.id, targetPowerFactor: 0.97 })]);
      break;
    }
  }
  outcomes.push(['pf correction at a DC element', () => correctPowerFactor(s, { at: s.result.elements.find((e) => e.output?.kind === 'dc')?.id ?? 'nowhere', targetPowerFactor: 0.97 })]);
  outcomes.push(['pf correction at nothing', () => correctPowerFactor(s, { at: 'nowhere', targetPowerFactor: 0.97 })]);
  for (const [what, run] of outcomes) {
    const out = run() as { ok?: boolean; problems?: Problem[]; result?: unknown } & Json;
    if (out && out.ok === false && Array.isArray(out.problems)) sayProblems(`${where} ${what}`, out.problems, names, s.project);
    else sayWarnings(`${where} ${what}`, out, names);
    if (what === 'pump duty' && out && out.ok === true) {
      const r = out['result'] as Parameters<typeof pumpDutyCosts>[0];
      for (const price of [0.2, -1]) {
        const c = pumpDutyCosts(r, price);
        if (!c.ok) sayProblems(`${where} pump duty costs`, c.problems, names, s.project);
      }
    }
  }
}

function walkProject(where: string, project: unknown, withStudies: boolean): void {
  const names = namesOf(project);
  const s = solveProject(project);
  if (!s.ok) {
    refusedCount++;
    sayProblems(where, s.problems, names, project);
    return;
  }
  solvedCount++;
  sayWarnings(`${where} result`, s.result, names);
  if (withStudies) studies(where, s, names);
}

/** The leaves of an element (numbers, text, true/false), as paths. */
function leaves(v: unknown, path: string[] = []): string[][] {
  if (Array.isArray(v)) return v.flatMap((x, i) => leaves(x, [...path, String(i)]));
  if (typeof v === 'object' && v !== null) return Object.entries(v).flatMap(([k, x]) => leaves(x, [...path, k]));
  return path.length ? [path] : [];
}

function setAt(obj: Json, path: readonly string[], value: unknown): void {
  let o: Json = obj;
  for (const k of path.slice(0, -1)) o = o[k] as Json;
  const last = path[path.length - 1]!;
  if (value === undefined) delete o[last];
  else o[last] = value;
}

/** The broken values a number, a text or a flag is set to. */
function brokenValues(v: unknown): unknown[] {
  if (typeof v === 'number') return [undefined, -1, 0, 1e30, 1 / 24000, 'x', v * 1.2345678, v * 40];
  if (typeof v === 'string') return [undefined, '', 7, 'no-such-choice'];
  return [undefined, 'x'];
}

const bases: { label: string; project: unknown }[] = [
  ...demoProjects.map((d) => ({ label: `demo ${d.id}`, project: d.project as unknown })),
  { label: 'battery bank with a backup study', project: batteryBenchProject() },
  // The running cost (energy price, hours a year) in the file: its broken values too.
  { label: 'demo riverside-pump-station with its running cost', project: { ...(demoProjects.find((d) => d.id === 'riverside-pump-station')!.project as object), running: { energyPricePerKWh: 0.2, hoursPerYear: 6000 } } },
  // The cost over the years (tariff, years, discount rate, CO₂, generator fuel) and an element's purchase price: broken values too.
  {
    label: 'demo cold-store-dc-bus with its cost over the years',
    project: (() => {
      const p = structuredClone(demoProjects.find((d) => d.id === 'cold-store-dc-bus')!.project) as unknown as ProjectJson;
      p.elements[1]!['price'] = 1800;
      return { ...p, running: { energyPricePerKWh: 0.3, nightPricePerKWh: 0.12, dayStartHour: 6, dayEndHour: 22, hoursPerYear: 8000, years: 12, discountRate: 0.04, gridCo2KgPerKWh: 0.35, generator: { quarterLoadLitresPerHour: 2.3, halfLoadLitresPerHour: 3.4, fullLoadLitresPerHour: 6.1, ratedPower: 20000, outageHoursPerYear: 30, outagesPerYear: 4, fuelPricePerLitre: 1.6 } } };
    })(),
  },
];

describe('every message the engine produces is in the user\'s words', () => {
  for (const b of bases) {
    walkProject(b.label, b.project, true);
    const p = b.project as ProjectJson;
    p.elements.forEach((e, i) => {
      for (const path of leaves(e)) {
        if (path[0] === 'id' || path[0] === 'name' || path[0] === 'kind' || path[0] === 'from') continue;
        let v: unknown = e;
        for (const k of path) v = (v as Json)[k];
        for (const broken of brokenValues(v)) {
          const copy = structuredClone(p);
          setAt(copy.elements[i]!, path, broken);
          walkProject(`${b.label}: ${String(e['id'])}.${path.join('.')} = ${JSON.stringify(broken)}`, copy, false);
        }
      }
    });
    for (const key of ['backup', 'dropLimits', 'pumpDuty', 'running'] as const) {
      if (p[key] === undefined) continue;
      for (const path of leaves(p[key])) {
        let v: unknown = p[key];
        for (const k of path) v = (v as Json)[k];
        for (const broken of brokenValues(v)) {
          const copy = structuredClone(p) as Json;
          setAt(copy[key] as Json, path, broken);
          walkProject(`${b.label}: ${key}.${path.join('.')} = ${JSON.stringify(broken)}`, copy, typeof broken === 'number');
        }
      }
    }
    // The tree's shape: an unknown feed, a second source, a duplicate id, a kind that does not fit.
    const shapes: [string, (c: ProjectJson) => void][] = [
      ['unknown feed', (c) => (c.elements[1]!['from'] = 'nowhere')],
      ['second source', (c) => c.elements.push({ ...c.elements[0]!, id: 'second-source', name: 'Second source' })],
      ['duplicate id', (c) => c.elements.push({ ...c.elements[c.elements.length - 1]!, name: 'Twin' })],
      ['cycle', (c) => (c.elements[0]!['from'] = String(c.elements[c.elements.length - 1]!['id']))],
      ['fed by a load', (c) => c.elements.push({ ...c.elements[1]!, id: 'after-load', name: 'After the load', from: String(c.elements[c.elements.length - 1]!['id']) })],
      ['heavy load', (c) => c.elements.forEach((e) => typeof e['power'] === 'number' && (e['power'] = (e['power'] as number) * 1000))],
    ];
    for (const [what, edit] of shapes) {
      const copy = structuredClone(p);
      edit(copy);
      walkProject(`${b.label}: ${what}`, copy, false);
    }
  }

  it('walks a meaningful corpus (the collectors work)', () => {
    expect(solvedCount).toBeGreaterThan(50);
    expect(refusedCount).toBeGreaterThan(300);
    expect(said.length).toBeGreaterThan(2000);
    expect(CAMEL_KEYS).toEqual(expect.arrayContaining(['ratedVoltage', 'shortCircuitPower']));
  });

  it('the checks catch what they must (made-up lines, no source needed)', () => {
    const names = new Map([['drive', 'Pump drive']]);
    expect(offence({ where: '', text: 'not applied (no ratedVoltage given)', names })).toBe('file-format field name "ratedVoltage"');
    expect(offence({ where: '', text: 'drive "drive" runs motor "motor"', names })).toMatch(/element id "drive"/);
    expect(offence({ where: '', text: 'flow 0.0416666666666667 m³/s', names })).toBe('unformatted number 0.0416666666666667');
    expect(offence({ where: '', text: 'must not exceed 1e+30', names })).toBe('unformatted number 1e+30');
    expect(offence({ where: '', text: '"Pump drive" runs at 150 m³/h, 41.7 mm², IEC 60364-5-52 Table B.52.4, rated voltage', names })).toBeUndefined();
  });

  it('no message names a file-format field, an element id where a name belongs, or an unformatted number', () => {
    const seen = new Set<string>();
    const bad: string[] = [];
    for (const s of said) {
      const what = offence(s);
      if (!what) continue;
      const key = `${what}|${s.text}`;
      if (seen.has(key)) continue;
      seen.add(key);
      bad.push(`${s.where}: ${what} — ${s.text.slice(0, 240)}`);
    }
    if (process.env['JP_MESSAGES_DUMP']) writeFileSync(process.env['JP_MESSAGES_DUMP'], bad.join('\n'));
    expect(bad.join('\n')).toBe('');
  });
});

// ---------- (a) the static walk ----------

function sourceFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) return sourceFiles(path);
    return entry.name.endsWith('.ts') ? [path] : [];
  });
}

/** A call or property whose text users read. */
const MESSAGE_KEYS = new Set(['message', 'warning', 'note', 'caution', 'reason', 'text', 'template']);
const MESSAGE_CALLS = /^(warn|note|caution|refuse|problem|push|Error|ProjectError|say)$/;

describe('the engine\'s message texts (static walk over core/)', () => {
  const found: string[] = [];
  let read = 0;
  for (const path of sourceFiles(join(repoRoot, 'core'))) {
    const file = relative(repoRoot, path).split('\\').join('/');
    // Tables carry data, the CLI's own help names its flags and the file format's keys on purpose.
    if (file.startsWith('core/data/') || file.startsWith('core/cli/args.ts')) continue;
    const source = readFileSync(path, 'utf8');
    const ast = parse(source, { sourceType: 'module', plugins: ['typescript'] });
    const check = (node: unknown, line: number): void => {
      const n = node as { type?: string; [k: string]: unknown };
      const texts: string[] = [];
      let idHole = false;
      const collect = (x: unknown): void => {
        const m = x as { type?: string; [k: string]: unknown };
        if (!m || typeof m !== 'object') return;
        // A bare word is a key or a field's path (the machine path a problem carries), not text users read.
        if (m.type === 'StringLiteral') {
          if (/\s/.test((m['value'] as string).trim())) texts.push(m['value'] as string);
        }
        else if (m.type === 'TemplateLiteral') {
          const quasis = m['quasis'] as { value: { cooked: string } }[];
          const exprs = m['expressions'] as { type?: string; property?: { name?: string }; name?: string }[];
          quasis.forEach((q, i) => {
            texts.push(q.value.cooked);
            const e = exprs[i];
            const isId = e && ((e.type === 'MemberExpression' && e.property?.name === 'id') || (e.type === 'Identifier' && /^(id|elementId|\w+Id)$/.test(e.name ?? '')));
            // "no element has the id "x"": an id that names nothing is quoted as the id it is.
            if (isId && q.value.cooked.endsWith('"') && !/\bid "$/.test(q.value.cooked) && quasis[i + 1]?.value.cooked.startsWith('"')) idHole = true;
          });
          exprs.forEach(collect);
        } else if (m.type === 'BinaryExpression' || m.type === 'ConditionalExpression' || m.type === 'LogicalExpression') {
          for (const k of ['left', 'right', 'consequent', 'alternate']) collect(m[k]);
        }
      };
      collect(n);
      read += texts.length;
      for (const t of texts) {
        const key = t.match(CAMEL_RE);
        if (key) found.push(`${file}:${line}: file-format field name "${key[1]}" — ${t.slice(0, 160)}`);
      }
      if (idHole) found.push(`${file}:${line}: an element id in quotes where its name belongs`);
    };
    const walk = (node: unknown): void => {
      if (Array.isArray(node)) return node.forEach(walk);
      if (typeof node !== 'object' || node === null) return;
      const n = node as { type?: string; loc?: { start: { line: number } }; [k: string]: unknown };
      if (n.type === 'ImportDeclaration' || n.type?.startsWith('TS')) return;
      const line = n.loc?.start.line ?? 0;
      if (n.type === 'ObjectProperty') {
        const k = n['key'] as { name?: string; value?: string };
        if (MESSAGE_KEYS.has(k.name ?? k.value ?? '')) check(n['value'], line);
      }
      if (n.type === 'CallExpression' || n.type === 'NewExpression') {
        const callee = n['callee'] as { type?: string; name?: string; property?: { name?: string } };
        const name = callee.type === 'Identifier' ? callee.name : callee.property?.name;
        if (name && MESSAGE_CALLS.test(name)) for (const a of n['arguments'] as unknown[]) check(a, line);
      }
      if (n.type === 'ReturnStatement' && n['argument'] && ((n['argument'] as { type?: string }).type === 'TemplateLiteral')) check(n['argument'], line);
      for (const [k, v] of Object.entries(n)) if (k !== 'loc' && k !== 'start' && k !== 'end' && k !== 'extra' && !k.endsWith('Comments')) walk(v);
    };
    walk(ast.program);
  }

  it('reads the message texts of core/', () => {
    expect(read).toBeGreaterThan(500);
  });

  it('no message text names a file-format field or quotes an element id', () => {
    if (process.env['JP_MESSAGES_DUMP']) writeFileSync(`${process.env['JP_MESSAGES_DUMP']}.static`, found.join('\n'));
    expect(found.join('\n')).toBe('');
  });
});

// ---------- how a number is written ----------

describe('numbers in messages (core/model/message.ts)', () => {
  it('3 significant digits, SI prefixes from 1000 up, large whole numbers grouped, tiny and huge ones with a power of ten', () => {
    // SI Brochure, 9th ed.: prefixes (Table 7), digits grouped in threes (5.4.4); common practice (no source) for 3 digits.
    expect(valueText(q(1e6, 'V'))).toBe('1 MV');
    expect(valueText(q(0.1, 'V'))).toBe('0.1 V');
    expect(valueText(q(1e5, 'm'))).toBe('100 km');
    expect(valueText(q(150 / 3600, 'm³/s'))).toBe('0.0417 m³/s');
    expect(valueText(q(1e12, 'Ah'))).toBe('1\u202f000\u202f000\u202f000\u202f000 Ah');
    expect(valueText(q(1 / 24000, 'A'))).toBe('4.17 × 10⁻⁵ A');
    expect(valueText(q(-80, '°C'))).toBe('−80 °C');
    expect(sigText(1.7976931348623157e308)).toBe('1.8 × 10³⁰⁸');
    expect(figure(1920, 1)).toBe('1920');
    expect(figure(5, 1)).toBe('5.0');
  });
  it('say keeps the quantities: the SI text, the template and the values; a message inside a message keeps its own', () => {
    const inner = say`the plausible range is ${q(0, 'm³/s')} to ${q(1000, 'm³/s')}`;
    const w = say`must not exceed ${q(1000, 'm³/s')}: ${inner}`;
    expect(w.message).toBe('must not exceed 1000 m³/s: the plausible range is 0 m³/s to 1000 m³/s');
    expect(w.template).toBe('must not exceed {0}: the plausible range is {1} to {2}');
    expect(w.values).toEqual([q(1000, 'm³/s'), q(0, 'm³/s'), q(1000, 'm³/s')]);
    expect(say`no numbers`).toEqual({ message: 'no numbers' });
  });
  it('a range refusal carries its bounds to the page through the validation', () => {
    const p = structuredClone(demoProjects.find((d) => d.id === 'riverside-pump-station')!.project) as unknown as ProjectJson;
    p.elements.find((e) => e['id'] === 'feeder')!['length'] = 1e9;
    const s = solveProject(p);
    if (s.ok) throw new Error('solved');
    const at = s.problems.find((x) => x.field === 'length')!;
    // core/kinds/ranges.ts: a cable run is at most 100 km.
    expect(at.message).toBe('must not exceed 100 km: the plausible range of a cable length is 0 m to 100 km (check the value and its unit)');
    expect(at.template).toBe('must not exceed {0}: the plausible range of a cable length is {1} to {2} (check the value and its unit)');
    expect(at.values).toEqual([q(1e5, 'm'), q(0, 'm'), q(1e5, 'm')]);
    expect(formatProblem(at, p)).toBe(`"Feeder to drive, 1/0 Cu in PVC conduit", Route length (one way): ${at.message}`);
  });
});
