/**
 * What users read uses their words (issue 14, point 16; owner's rules): a typical value says
 * "typical value: use the maker's figure", never "from memory" or "no source" (those belong in code
 * comments and tests only); no file-format field names (the schemas' camelCase keys such as
 * ratedVoltage); no unformatted floats (more than 6 significant digits, e.g. 0.0416666666666667).
 *
 * Read here: every demo and a set of built projects (random valid chains covering every kind, a
 * battery bank with a backup study, circuit loads) through the solve result's strings (notes,
 * steps, warnings, method), the CLI text report, the machines, surge and battery text reports and
 * their results' strings (cautions, methods), power-factor correction and costs; and the page's
 * static words: string literals and JSX text of web/**\/*.tsx, and the labels, help and choices of
 * web/editor/fields.ts; and every string literal of the engine's sources (core/, tables aside) for
 * the forbidden words, so a message on a path no project here reaches is caught as well.
 *
 * Each offender is reported with where it was read and the area that writes it; one test per area,
 * so every offender of every area shows at once. Areas other helpers own (battery, surge,
 * power-factor correction, conductors) are reported, not fixed, here.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parse } from '@babel/parser';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CAMEL_KEYS, CAMEL_RE } from './schema-keys.ts';
import { demoProjects } from '../../core/demos/index.ts';
import { solveProject } from '../../core/solve/index.ts';
import { formatResult } from '../../core/cli/text-report.ts';
import { studySurges, formatSurgeStudy } from '../../core/studies/surge/index.ts';
import { runBackupStudy } from '../../core/studies/backup/study.ts';
import { formatBackupStudy } from '../../core/studies/backup/text-report.ts';
import { bankCautions, rechargeCautions } from '../../core/studies/backup/cautions.ts';
import { machineSections } from '../../core/cli/machines-flags.ts';
import { correctPowerFactor } from '../../core/studies/pf/correction.ts';
import { formatPfCorrection } from '../../core/studies/pf/text-report.ts';
import { flowGraph } from '../../core/studies/energy-flow.ts';
import { lossCostPerYear, pumpDutyCosts } from '../../core/studies/economics.ts';
import { formatLifetimeCost, lifetimeCost } from '../../core/studies/lifetime.ts';
import { projectPumpDuty } from '../../core/studies/machines/pump-duty.ts';
import { CONDUCTOR_CAUTION } from '../../core/conductors/index.ts';
import type { SolveResult } from '../../core/model/result.ts';
import { DROP_BASES, KIND_FORMS, PROJECT_FIELDS, allFields, defaultElement, type FieldSpec } from '../../web/editor/fields.ts';
import type { ElementKind } from '../../core/model/project.ts';
import { projectArb, projectWithNetworksArb } from '../core/arbitraries.ts';
import { batteryBenchProject } from '../battery/fixtures.ts';
import { onSolved } from '../core/solved.ts';

const repoRoot = fileURLToPath(new URL('../..', import.meta.url));

/** Who writes a text: our areas, or an area another helper owns (reported, not fixed, here). */
type Area = 'ours' | 'battery' | 'surge' | 'pf-correction' | 'conductors';
const AREAS: readonly Area[] = ['ours', 'battery', 'surge', 'pf-correction', 'conductors'];
interface Read {
  area: Area;
  where: string;
  text: string;
  /**
   * False for a page string literal without a space: a key, path or class name in code
   * (`e['ratedPower']`), checked for the forbidden words and long numbers but not for field names.
   */
  code?: boolean;
}

// ---------- the words that must not reach users ----------

/** The owner's rules: these belong in code comments and tests only. */
const FORBIDDEN: readonly RegExp[] = [/from memory/i, /no source/i];


/** A decimal with more than 6 significant digits (leading zeros are not significant). */
function longFloat(text: string): string | undefined {
  for (const m of text.matchAll(/(?<![\w.])\d+\.\d+(?:e[+-]?\d+)?(?![\w.])/gi)) {
    const digits = m[0].replace(/e.*$/i, '').replace('.', '').replace(/^0+/, '');
    if (digits.length > 6) return m[0];
  }
  return undefined;
}

/** What is wrong with one text (undefined when nothing). */
function offence(text: string, code = false): string | undefined {
  for (const re of FORBIDDEN) {
    const m = text.match(re);
    if (m) return `says "${m[0]}"`;
  }
  const key = code ? null : text.match(CAMEL_RE);
  if (key) return `file-format field name "${key[1]}"`;
  const f = longFloat(text);
  if (f) return `unformatted number ${f}`;
  return undefined;
}

// ---------- what the engine says ----------

/** Result keys whose strings are identifiers or the user's own words, not the engine's. */
// `field`: the file-format path a check or problem points the form at; shown only through its label.
const NOT_PROSE = new Set(['id', 'elementId', 'field', 'from', 'feeds', 'kind', 'code', 'projectName', 'name', 'at', 'role', 'pfSense', 'system', 'material']);

/** Every string of a plain-data value, with its path (identifiers and user-given names left out). */
function strings(value: unknown, path = ''): { path: string; text: string }[] {
  if (typeof value === 'string') return [{ path, text: value }];
  if (typeof value !== 'object' || value === null) return [];
  return Object.entries(value).flatMap(([k, v]) => (NOT_PROSE.has(k) ? [] : strings(v, path ? `${path}.${k}` : k)));
}

/** A solve result's strings: those under a conductor (and conductor-check warnings) are the conductors area's. */
function resultReads(result: SolveResult, where: string): Read[] {
  const reads: Read[] = [];
  result.elements.forEach((e) => {
    for (const s of strings(e)) reads.push({ area: /(^|\.)conductor(\.|$)/.test(s.path) ? 'conductors' : 'ours', where: `${where} result ${e.name}.${s.path}`, text: s.text });
  });
  for (const w of result.warnings) reads.push({ area: w.code === 'conductor-check' ? 'conductors' : 'ours', where: `${where} warning ${w.code}`, text: w.message });
  const { elements: _e, warnings: _w, ...rest } = result;
  for (const s of strings(rest)) reads.push({ area: /drop|conductor/i.test(s.path) ? 'conductors' : 'ours', where: `${where} result ${s.path}`, text: s.text });
  return reads;
}

/**
 * A text report's lines. A line showing a string another area wrote (a conductor's note in the CLI
 * tables) is that area's.
 */
function textReads(text: string, area: Area, where: string, others: readonly Read[]): Read[] {
  return text.split('\n').map((line, i) => {
    const owner = others.find((o) => o.area !== area && o.text.length >= 12 && (line.includes(o.text) || o.text.includes(line.trim())) && line.trim().length >= 12);
    return { area: owner?.area ?? area, where: `${where} line ${i + 1}`, text: line };
  });
}

/** Projects that did not solve (each must: a refused project would be read for nothing). */
const unsolved: string[] = [];

function projectReads(project: unknown, label: string): Read[] {
  const reads: Read[] = [];
  const solved = solveProject(project);
  if (!solved.ok) {
    unsolved.push(`${label}: ${solved.problems.map((p) => p.message).join('; ')}`);
    return reads;
  }
  const result = solved.result;
  const fromResult = resultReads(result, label);
  reads.push(...fromResult);
  reads.push(...textReads(formatResult(result), 'ours', `${label} CLI text`, fromResult));
  for (const s of strings(flowGraph(result))) reads.push({ area: 'ours', where: `${label} energy flow ${s.path}`, text: s.text });
  const cost = lossCostPerYear(result, { pricePerKWh: 0.2, hoursPerYear: 8760 });
  for (const s of strings(cost)) reads.push({ area: 'ours', where: `${label} loss cost ${s.path}`, text: s.text });
  // The cost over the years, with every part that words something (tariff, CO₂, generator over outages and recharges, purchase).
  const life = lifetimeCost(solved, { dayPricePerKWh: 0.3, nightPricePerKWh: 0.1, dayStartHour: 7, dayEndHour: 23, hoursPerYear: 8760, years: 10, discountRate: 0.05, gridCo2KgPerKWh: 0.4, generator: { quarterLoadLitresPerHour: 2.3, halfLoadLitresPerHour: 3.4, fullLoadLitresPerHour: 6.1, ratedPower: 1e9, outageHoursPerYear: 20, outagesPerYear: 3, fuelPricePerLitre: 1.6 } }, { energyWh: 2000, timeSeconds: 7200 });
  if (life.ok) {
    for (const s of strings(life.cost)) reads.push({ area: 'ours', where: `${label} cost over the years ${s.path}`, text: s.text });
    reads.push(...textReads(formatLifetimeCost(life.cost), 'ours', `${label} cost over the years text`, []));
  } else unsolved.push(`${label} cost over the years: ${life.problems.map((p) => p.message).join('; ')}`);

  const surge = onSolved(studySurges, project);
  if (surge.ok) {
    const surgeReads = strings(surge.result).map((s): Read => ({ area: 'surge', where: `${label} surge ${s.path}`, text: s.text }));
    reads.push(...surgeReads, ...textReads(formatSurgeStudy(surge.result), 'surge', `${label} surge text`, []));
  }
  const machines = machineSections(solved, true, undefined);
  if (machines.ok) {
    reads.push(...textReads(machines.text, 'ours', `${label} machines text`, []));
    for (const s of strings(machines.json)) reads.push({ area: 'ours', where: `${label} machines ${s.path}`, text: s.text });
  }
  const flow = onSolved(projectPumpDuty, project);
  if (flow.ok) {
    const costs = pumpDutyCosts(flow.result, 0.2);
    if (costs.ok) for (const s of strings(costs.costs)) reads.push({ area: 'ours', where: `${label} pump-duty costs ${s.path}`, text: s.text });
  }
  const p = project as { backup?: unknown; elements: { id: string; kind: string; bank?: unknown }[] };
  if (p.backup !== undefined && p.elements.some((e) => e.kind === 'battery' && e.bank !== undefined)) {
    const study = onSolved(runBackupStudy, project);
    if (study.ok) {
      const chemistry = study.study.discharge.bank.chemistry;
      reads.push(...textReads(formatBackupStudy(study.study), 'battery', `${label} battery text`, []));
      for (const s of strings(study.study)) reads.push({ area: 'battery', where: `${label} battery ${s.path}`, text: s.text });
      for (const c of [...bankCautions(chemistry), ...rechargeCautions(chemistry)]) reads.push({ area: 'battery', where: `${label} battery cautions`, text: c });
    }
  }
  // Power-factor correction at the first element with a lagging AC interface below 0.95.
  const at = result.elements.find((e) => e.input && e.input.kind !== 'dc' && e.input.kind !== 'shaft' && e.input.pfSense === 'lagging' && e.input.powerFactor < 0.95);
  if (at) {
    const c = onSolved(correctPowerFactor, project, { at: at.id, targetPowerFactor: 0.97 });
    if (c.ok) {
      const { resultBefore: _b, resultAfter: _a, correctedProject: _p, ...shown } = c.correction;
      for (const s of strings(shown)) reads.push({ area: 'pf-correction', where: `${label} pf correction ${s.path}`, text: s.text });
      reads.push(...textReads(formatPfCorrection(c.correction), 'pf-correction', `${label} pf correction text`, []));
    }
  }
  return reads;
}

/** A demo changed by `edit` (a copy; the demo itself is left alone). */
function variant(id: string, edit: (p: { elements: Record<string, unknown>[]; [k: string]: unknown }) => void): unknown {
  const p = structuredClone(demoProjects.find((d) => d.id === id)!.project) as unknown as { elements: Record<string, unknown>[] };
  edit(p);
  return p;
}
const element = (p: { elements: Record<string, unknown>[] }, id: string) => p.elements.find((e) => e['id'] === id)!;

/**
 * Built projects: random valid chains over every kind (fixed seeds, so the list is stable), a
 * backed-up bank, and demos turned to the paths their defaults do not take (a motor by efficiency
 * class started direct on line from a weak grid given by its short-circuit power, a lead-acid bank,
 * presets without the maker's figures).
 */
function builtProjects(): { label: string; project: unknown }[] {
  const chains = fc.sample(projectArb, { seed: 14, numRuns: 25 });
  const networks = fc.sample(projectWithNetworksArb, { seed: 16, numRuns: 10 });
  return [
    ...chains.map((project, i) => ({ label: `built chain ${i + 1}`, project })),
    ...networks.map((project, i) => ({ label: `built chain with circuit loads ${i + 1}`, project })),
    { label: 'built battery bank with a backup study', project: batteryBenchProject() },
    {
      label: 'pump station, NEMA Premium motor by class, started direct on line, grid by short-circuit power',
      project: variant('riverside-pump-station', (p) => {
        const grid = element(p, 'service');
        delete grid['resistance'];
        delete grid['reactance'];
        grid['shortCircuitPower'] = 5e6;
        const motor = element(p, 'motor');
        delete motor['loss'];
        delete motor['powerFactor'];
        motor['efficiencyClass'] = 'NEMA-premium';
        motor['poles'] = 4;
        motor['ratedFrequency'] = 60;
        motor['starting'] = { method: 'dol' };
      }),
    },
    {
      label: 'relay hut on a lead-acid bank',
      project: variant('hillside-relay-hut', (p) => {
        element(p, 'bank')['bank'] = { chemistry: 'vrla-agm', series: 24, strings: 1, capacityAh: 200 };
      }),
    },
    {
      label: 'relay hut on a flooded lead-acid bank, cold',
      project: variant('hillside-relay-hut', (p) => {
        element(p, 'bank')['bank'] = { chemistry: 'flooded-lead-acid', series: 24, strings: 1, capacityAh: 300 };
        (p['backup'] as Record<string, unknown>)['temperatureC'] = -5;
      }),
    },
  ];
}

// ---------- what the page says ----------

function sourceFiles(dir: string, ext: RegExp): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) return sourceFiles(path, ext);
    return ext.test(entry.name) ? [path] : [];
  });
}

/** JSX attributes whose values users read; other attributes (class, data-*, ids) are code. */
const SHOWN_ATTRIBUTES = new Set(['title', 'aria-label', 'aria-description', 'placeholder', 'alt', 'label', 'summary']);

/** String literals, template text and JSX text of one .tsx file, with their lines. */
function tsxReads(path: string): Read[] {
  const file = relative(repoRoot, path).split('\\').join('/');
  const ast = parse(readFileSync(path, 'utf8'), { sourceType: 'module', plugins: ['typescript', 'jsx'] });
  const reads: Read[] = [];
  const walk = (node: unknown, parentAttr?: string): void => {
    if (Array.isArray(node)) return node.forEach((n) => walk(n, parentAttr));
    if (typeof node !== 'object' || node === null) return;
    const n = node as { type?: string; loc?: { start: { line: number } }; [k: string]: unknown };
    if (n.type === 'ImportDeclaration' || n.type === 'ExportAllDeclaration' || n.type?.startsWith('TS')) return;
    if (n.type === 'JSXAttribute') {
      const name = (n['name'] as { name?: unknown }).name;
      const attr = typeof name === 'string' ? name : '';
      if (!SHOWN_ATTRIBUTES.has(attr)) return;
      return walk(n['value'], attr);
    }
    const line = n.loc?.start.line ?? 0;
    if (n.type === 'JSXText' && typeof n['value'] === 'string' && n['value'].trim()) reads.push({ area: 'ours', where: `${file}:${line}`, text: n['value'].trim() });
    if (n.type === 'StringLiteral' && typeof n['value'] === 'string') reads.push({ area: 'ours', where: `${file}:${line}`, text: n['value'], code: !/\s/.test(n['value'].trim()) });
    if (n.type === 'TemplateElement') {
      const cooked = (n['value'] as { cooked?: string }).cooked;
      if (cooked) reads.push({ area: 'ours', where: `${file}:${line}`, text: cooked, code: !/\s/.test(cooked.trim()) });
    }
    for (const [k, v] of Object.entries(n)) if (k !== 'loc' && k !== 'start' && k !== 'end' && k !== 'extra') walk(v, parentAttr);
  };
  walk(ast.program);
  return reads;
}

/** The form's labels, help and choices for every kind (choices listed for both unit systems). */
function formReads(): Read[] {
  const reads: Read[] = [];
  const push = (where: string, text: string | undefined) => {
    if (text) reads.push({ area: 'ours', where: `web/editor/fields.ts ${where}`, text });
  };
  const fieldReads = (fields: readonly FieldSpec[], element: Record<string, unknown>, where: string) => {
    for (const f of allFields(fields)) {
      const at = `${where} ${f.type === 'group' ? f.key : f.path}`;
      push(`${at} label`, f.label);
      push(`${at} help`, f.help);
      if (f.type === 'choice') {
        for (const units of ['si', 'us'] as const) {
          const options = typeof f.options === 'function' ? f.options(element, { units }) : f.options;
          for (const o of options) {
            push(`${at} choice`, o.label);
            push(`${at} choice (disabled)`, o.disabled);
          }
        }
      }
      if (f.type === 'points') for (const c of f.columns) push(`${at} column`, c.label);
      if (f.type === 'group') for (const v of f.variants) {
        push(`${at} variant label`, v.label);
        push(`${at} variant help`, v.help);
      }
    }
  };
  for (const [kind, form] of Object.entries(KIND_FORMS)) fieldReads(form.fields, defaultElement(kind as ElementKind, 'x', 'y'), kind);
  fieldReads(PROJECT_FIELDS, {}, 'project');
  for (const o of DROP_BASES) push('drop basis choice', o.label);
  return reads;
}

// ---------- what the engine could say on paths no project above reaches ----------

/** The area of an engine source file (others' areas are reported, not fixed, here). */
function areaOfFile(file: string): Area | undefined {
  if (file.startsWith('core/studies/backup/')) return 'battery';
  if (file.startsWith('core/studies/surge/')) return 'surge';
  if (file === 'core/studies/pf/correction.ts') return 'pf-correction';
  if (file.startsWith('core/conductors/') || file === 'core/solve/size-conductors.ts' || file === 'core/kinds/cable.ts') return 'conductors';
  // Tables (core/data/) carry provenance marks as data, by the data-table rules: not text.
  if (file.startsWith('core/data/') || file === 'core/cli/cli.ts') return undefined;
  return 'ours';
}

/** A provenance mark compared or stored as data (`mark === 'from memory'`), not a sentence. */
const MARKS = new Set(['from memory', 'common practice']);

/**
 * The string literals and template text of every engine file, checked for the forbidden words
 * only (their numbers are filled in at run time; field names appear in refusals on purpose).
 */
function engineSourceReads(): Read[] {
  const reads: Read[] = [];
  for (const path of sourceFiles(join(repoRoot, 'core'), /\.ts$/)) {
    const file = relative(repoRoot, path).split('\\').join('/');
    const area = areaOfFile(file);
    if (!area) continue;
    const ast = parse(readFileSync(path, 'utf8'), { sourceType: 'module', plugins: ['typescript'] });
    const walk = (node: unknown): void => {
      if (Array.isArray(node)) return node.forEach(walk);
      if (typeof node !== 'object' || node === null) return;
      const n = node as { type?: string; loc?: { start: { line: number } }; [k: string]: unknown };
      if (n.type === 'ImportDeclaration' || n.type?.startsWith('TS')) return;
      const line = n.loc?.start.line ?? 0;
      const text = n.type === 'StringLiteral' ? (n['value'] as string) : n.type === 'TemplateElement' ? (n['value'] as { cooked?: string }).cooked : undefined;
      if (text && !MARKS.has(text.trim())) reads.push({ area, where: `${file}:${line}`, text, code: true });
      for (const [k, v] of Object.entries(n)) if (k !== 'loc' && k !== 'start' && k !== 'end' && k !== 'extra' && k !== 'leadingComments' && k !== 'trailingComments' && k !== 'innerComments') walk(v);
    };
    walk(ast.program);
  }
  return reads;
}

// ---------- the checks ----------

function offenders(reads: readonly Read[]): Map<Area, string[]> {
  const byArea = new Map<Area, string[]>(AREAS.map((a) => [a, []]));
  const seen = new Set<string>();
  for (const r of reads) {
    const what = offence(r.text, r.code);
    if (!what) continue;
    const line = `${r.where}: ${what} — ${r.text.trim().slice(0, 240)}`;
    const key = `${r.area}|${what}|${r.text.trim()}`;
    if (seen.has(key)) continue; // the same text from several projects: listed once
    seen.add(key);
    byArea.get(r.area)!.push(line);
  }
  return byArea;
}

describe('what users read uses their words', () => {
  const reads: Read[] = [];
  for (const demo of demoProjects) reads.push(...projectReads(demo.project, `demo ${demo.id}`));
  for (const b of builtProjects()) reads.push(...projectReads(b.project, b.label));
  reads.push({ area: 'conductors', where: 'CONDUCTOR_CAUTION', text: CONDUCTOR_CAUTION });
  for (const path of sourceFiles(join(repoRoot, 'web'), /\.tsx$/)) reads.push(...tsxReads(path));
  reads.push(...formReads());
  reads.push(...engineSourceReads());
  const found = offenders(reads);

  it('reads a meaningful amount of text (the collectors work)', () => {
    // Every kind of text source is present: results, CLI text, each study, the page.
    for (const marker of ['CLI text', 'surge text', 'machines text', 'battery text', 'pf correction', 'web/components/', 'web/editor/fields.ts', 'core/kinds/']) {
      expect(reads.some((r) => r.where.includes(marker)), marker).toBe(true);
    }
    expect(reads.length).toBeGreaterThan(2000);
    expect(unsolved).toEqual([]);
    // The schema keys include the names users must not see (the brief's examples).
    expect(CAMEL_KEYS).toEqual(expect.arrayContaining(['ratedVoltage', 'shortCircuitPower', 'maxDropPercent']));
  });

  it('the checks catch what they must (made-up lines, no source needed)', () => {
    expect(offence('Capacity factor 0.95 (from memory)')).toBe('says "from memory"');
    expect(offence('default 80 % (common practice, no source)')).toBe('says "no source"');
    expect(offence('not applied (no ratedVoltage given)')).toBe('file-format field name "ratedVoltage"');
    expect(offence('ratio 0.0416666666666667')).toBe('unformatted number 0.0416666666666667');
    expect(offence('NEC Table 310.16, 75 °C column; 2.5 mm²; 1234.56 W; rated voltage')).toBeUndefined();
    expect(offence("typical value: use the maker's figure")).toBeUndefined();
  });

  for (const area of AREAS) {
    it(`${area === 'ours' ? 'our areas (stages, solve, machines, CLI tables, flow, economics, web)' : `the ${area} area (another helper's: reported here, fixed there)`} say nothing users should not read`, () => {
      expect(found.get(area)!.join('\n')).toBe('');
    });
  }
});
