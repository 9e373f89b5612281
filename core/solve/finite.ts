/**
 * The last check before anything computed is shown: a result holding a number that is not finite
 * (NaN, ±Infinity) anywhere is refused, with a problem naming the element and the result field.
 * A figure that overflowed or divided by zero is never shown as a table of NaN.
 *
 * Used by the solve (core/solve/index.ts) on every result, and by the callers of the studies (the
 * CLI, the page's panel worker) on the battery, machines, surge, power-factor and cost results:
 * the studies themselves need not know of it.
 */
import type { Problem } from '../model/errors.ts';
import { PROJECT_LEVEL } from '../model/errors.ts';
import type { ElementResult, LossFitReport, PathDrop, PortResult, SolveResult, SolveWarning, WeightedEfficiency } from '../model/result.ts';

/** One number that is not finite, where it sits, and the element it belongs to. */
export interface NonFiniteFigure {
  /** Element id, or PROJECT_LEVEL when the figure belongs to no element. */
  elementId: string;
  /** The element's name as the result gives it, when it gives one. */
  elementName?: string;
  /** Path of the figure inside its element's part of the result (or inside the whole result). */
  path: string[];
  value: number;
}

const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null;

/** Keys the studies' results name their element by (besides `id`). */
const ELEMENT_KEYS = ['elementId', 'batteryId', 'motorId', 'driveId'] as const;

/** The element an object of a result stands for: `elementId` (or the like), or `id` beside a `name` or `kind`. */
function elementOf(obj: Record<string, unknown>): { id: string; name?: string } | undefined {
  const name = typeof obj['name'] === 'string' ? obj['name'] : undefined;
  for (const key of ELEMENT_KEYS) {
    const id = obj[key];
    if (typeof id === 'string') return { id, ...(name !== undefined ? { name } : {}) };
  }
  if (typeof obj['id'] === 'string' && (name !== undefined || typeof obj['kind'] === 'string')) return { id: obj['id'], ...(name !== undefined ? { name } : {}) };
  return undefined;
}

/** Nesting depth and objects a quick look reads before it leaves the answer to the full walk. */
const QUICK_DEPTH = 64;
const QUICK_OBJECTS = 1_000_000;
/** Objects the quick look in progress may still read (it is synchronous: one look at a time). */
let quickLeft = 0;

/**
 * The quick look at one object: true when a number in it (own or inherited enumerable values, so
 * never fewer than `findNonFinite` reads) is not finite, or when the look gives up.
 */
function quickLook(v: object, depth: number): boolean {
  if (--quickLeft < 0 || depth > QUICK_DEPTH) return true;
  if (Array.isArray(v)) {
    for (let i = 0; i < v.length; i++) {
      const x: unknown = v[i];
      if (typeof x === 'number') {
        if (!Number.isFinite(x)) return true;
      } else if (typeof x === 'object' && x !== null && quickLook(x, depth + 1)) return true;
    }
    return false;
  }
  for (const key in v) {
    const x: unknown = (v as Record<string, unknown>)[key];
    if (typeof x === 'number') {
      if (!Number.isFinite(x)) return true;
    } else if (typeof x === 'object' && x !== null && quickLook(x, depth + 1)) return true;
  }
  return false;
}

/**
 * Whether a plain-data value may hold a number that is not finite: false only when every number in
 * it was read and is finite. A sound result (nearly every one) is passed at the cost of reading its
 * numbers, without the paths, owners and seen-set the full walk keeps; a value nested deeper than
 * QUICK_DEPTH or larger than QUICK_OBJECTS (a loop in it, a shared part read many times) gets
 * "may", and the full walk decides.
 */
function mayHoldNonFinite(value: unknown): boolean {
  if (typeof value === 'number') return !Number.isFinite(value);
  if (!isRecord(value)) return false;
  quickLeft = QUICK_OBJECTS;
  return quickLook(value, 0);
}

/** 0 for a finite number, NaN for anything else (NaN, ±Infinity, and a value that is not a number). */
const z = (x: number): number => x * 0;
/** The same for an optional figure: absent counts as finite. */
const zo = (x: number | undefined): number => (x === undefined ? 0 : x * 0);

/** `z` summed over a port's figures (its phasors included). */
function portZ(p: PortResult | undefined): number {
  if (p === undefined) return 0;
  let s = z(p.voltage) + z(p.current) + z(p.p) + z(p.q) + z(p.s) + z(p.powerFactor) + zo(p.frequency) + zo(p.speed);
  const ph = p.phasor;
  if (ph !== undefined) s += z(ph.voltage.re) + z(ph.voltage.im) + z(ph.current.re) + z(ph.current.im);
  return s;
}

/** How the quick read of a solve result reads a field: a figure by name, an object by `quickLook` or by name, or not at all (text). */
type How<V> = NonNullable<V> extends number ? 'figure' : NonNullable<V> extends string | boolean | readonly string[] ? 'text' : 'object';
type Layout<T> = { readonly [K in keyof Required<T>]-?: How<T[K]> };
/*
 * The layouts `solveResultMayHoldNonFinite` reads, one entry per field of each type: a field added
 * to one of these types does not compile until it is listed here, which sends its author to the
 * reading below.
 */
export const RESULT_LAYOUT = {
  result: { projectName: 'text', method: 'object', elements: 'object', totals: 'object', warnings: 'object', voltageDrop: 'object' } satisfies Layout<SolveResult>,
  method: { name: 'text', tolerance: 'figure', iterations: 'figure', residual: 'figure' } satisfies Layout<SolveResult['method']>,
  totals: { sourcePower: 'figure', loadPower: 'figure', losses: 'figure', balanceError: 'figure', efficiency: 'figure' } satisfies Layout<SolveResult['totals']>,
  element: {
    id: 'text', name: 'text', kind: 'text', role: 'text', from: 'text', feeds: 'text', input: 'object', output: 'object', pIn: 'figure', pOut: 'figure',
    loss: 'figure', idleLoss: 'figure', efficiency: 'figure', loadFraction: 'figure', weighted: 'object', fit: 'object', conductor: 'object',
  } satisfies Layout<ElementResult>,
  port: { kind: 'text', voltage: 'figure', frequency: 'figure', current: 'figure', p: 'figure', q: 'figure', s: 'figure', powerFactor: 'figure', pfSense: 'text', phasor: 'object', speed: 'figure' } satisfies Layout<PortResult>,
  warning: { code: 'text', elementId: 'text', message: 'text', template: 'text', values: 'object' } satisfies Layout<SolveWarning>,
  pathDrop: {
    loadId: 'text', startId: 'text', startVoltage: 'figure', loadVoltage: 'figure', links: 'object', totalPercent: 'figure', perLinkLimitPercent: 'figure',
    totalLimitPercent: 'figure', limitBasis: 'text', exceedsLimit: 'text',
  } satisfies Layout<PathDrop>,
  pathLink: { id: 'text', dropPercent: 'figure', exceedsLimit: 'text' } satisfies Layout<PathDrop['links'][number]>,
  weighted: { euro: 'figure', cec: 'figure' } satisfies Layout<WeightedEfficiency>,
  fit: { p0: 'figure', k1: 'figure', k2: 'figure', rmsLossError: 'figure', maxEfficiencyError: 'figure' } satisfies Layout<LossFitReport>,
} as const;

/**
 * The quick read of a solve result, by name, as core/model/result.ts lays it out (RESULT_LAYOUT):
 * the objects built key by key — by core/solve/report.ts (`buildResult`, `portResult`),
 * core/conductors/path-drop.ts, and the weighted efficiencies and loss fit (core/kinds/models.ts
 * `lossReport`, core/physics/loss-model.ts `fitLossPolynomial`) — are read field by field; the
 * parts built in many places (a sized conductor's working, a warning's values) by the generic quick
 * look. Method: each figure x adds x·0 to a sum, which stays 0 only when every x is finite (NaN·0
 * and ±Infinity·0 are NaN, and a NaN stays in the sum); true as soon as a quick look says "may".
 */
function solveResultMayHoldNonFinite(r: SolveResult): boolean {
  const m = r.method;
  const t = r.totals;
  let s = z(m.tolerance) + z(m.iterations) + z(m.residual) + z(t.sourcePower) + z(t.loadPower) + z(t.losses) + z(t.balanceError) + z(t.efficiency);
  quickLeft = QUICK_OBJECTS;
  const elements = r.elements;
  for (let i = 0; i < elements.length; i++) {
    const e = elements[i]!;
    s += z(e.pIn) + z(e.pOut) + z(e.loss) + z(e.efficiency) + zo(e.idleLoss) + zo(e.loadFraction) + portZ(e.input) + portZ(e.output);
    const w = e.weighted;
    if (w !== undefined) s += z(w.euro) + z(w.cec);
    const f = e.fit;
    if (f !== undefined) s += z(f.p0) + z(f.k1) + z(f.k2) + z(f.rmsLossError) + z(f.maxEfficiencyError);
    if (e.conductor !== undefined && quickLook(e.conductor, 1)) return true;
  }
  for (const w of r.warnings) if (w.values !== undefined && quickLook(w.values, 1)) return true;
  const drops = r.voltageDrop;
  if (drops !== undefined) {
    for (let i = 0; i < drops.length; i++) {
      const d = drops[i]!;
      s += z(d.startVoltage) + z(d.loadVoltage) + z(d.totalPercent) + z(d.totalLimitPercent) + zo(d.perLinkLimitPercent);
      const links = d.links;
      for (let k = 0; k < links.length; k++) s += z(links[k]!.dropPercent);
    }
  }
  return s !== 0;
}

/**
 * Whether a solve result may hold a number that is not finite (see `solveResultMayHoldNonFinite`):
 * false only when every figure was read and is finite; true sends the solve to the full walk
 * (`nonFiniteProblems`), which decides and names. Used by the solve on every result
 * (core/solve/solved.ts): reading the known fields by name is several times quicker than a walk by
 * keys. It trusts the result's layout (RESULT_LAYOUT; tests/core/finite-read.test.ts poisons every figure
 * of solved results one by one, each demo's and the reference cases', and checks that each is seen).
 */
export function resultMayHoldNonFinite(result: SolveResult): boolean {
  return solveResultMayHoldNonFinite(result);
}

/**
 * Every number in a plain-data value that is not finite, at most `limit` of them (a broken result
 * is usually broken in many places; the first few say where).
 */
export function findNonFinite(value: unknown, limit = 50): NonFiniteFigure[] {
  if (!mayHoldNonFinite(value)) return [];
  type Owner = { id: string; name?: string; depth: number };
  const found: NonFiniteFigure[] = [];
  const seen = new WeakSet<object>();
  // Depth-first in the order of the keys, without recursion and without a path per value: one path
  // of keys, cut back to each entry's depth, copied only for a figure that is reported. `depth` is
  // the length of the path to the entry's container.
  const path: string[] = [];
  const stack: { v: unknown; depth: number; key: string | null; owner: Owner }[] = [{ v: value, depth: 0, key: null, owner: { id: PROJECT_LEVEL, depth: 0 } }];
  while (stack.length > 0 && found.length < limit) {
    const { v, depth, key, owner } = stack.pop()!;
    if (typeof v === 'number') {
      if (!Number.isFinite(v)) {
        path.length = depth;
        if (key !== null) path.push(key);
        found.push({ elementId: owner.id, ...(owner.name !== undefined ? { elementName: owner.name } : {}), path: path.slice(owner.depth), value: v });
      }
      continue;
    }
    if (!isRecord(v) || seen.has(v)) continue;
    seen.add(v);
    path.length = depth;
    if (key !== null) path.push(key);
    const el = Array.isArray(v) ? undefined : elementOf(v);
    const here: Owner = el ? { ...el, depth: path.length } : owner;
    const d = path.length;
    if (Array.isArray(v)) {
      for (let i = v.length - 1; i >= 0; i--) stack.push({ v: v[i], depth: d, key: String(i), owner: here });
    } else {
      const keys = Object.keys(v);
      for (let i = keys.length - 1; i >= 0; i--) stack.push({ v: v[keys[i]!], depth: d, key: keys[i]!, owner: here });
    }
  }
  return found;
}

/** Words for the result fields users meet most; any other key is spelled out from its parts. */
const FIELD_WORDS: Record<string, string> = {
  pIn: 'power in',
  pOut: 'power out',
  p: 'real power',
  q: 'reactive power',
  s: 'apparent power',
  re: 'real part',
  im: 'imaginary part',
  idleLoss: 'idle loss',
  powerFactor: 'power factor',
  pfSense: 'power factor sense',
  loadFraction: 'load fraction',
  sourcePower: 'source power',
  loadPower: 'load power',
  balanceError: 'balance error',
  p0: 'no-load loss',
  k1: 'linear loss term',
  k2: 'resistive loss term',
  euro: 'European weighted efficiency',
  cec: 'CEC weighted efficiency',
};

/** A result path in words: `input.current` → "input current"; list indices become "item n". */
export function fieldWords(path: readonly string[]): string {
  return path
    .map((key) => (/^\d+$/.test(key) ? `item ${Number(key) + 1}` : (Object.hasOwn(FIELD_WORDS, key) ? FIELD_WORDS[key] : undefined) ?? key.replace(/([a-z0-9])([A-Z])/g, '$1 $2').toLowerCase()))
    .join(' ');
}

const valueWords = (v: number): string => (Number.isNaN(v) ? 'not a number' : v > 0 ? 'infinite' : 'minus infinite');

/**
 * The problems for a result that holds numbers that are not finite: one per element, naming it
 * (by the name users gave it when `names` or the result knows it) and its first such field, with
 * up to three fields in the message. Empty when every number is finite.
 * `what` says what was computed ("the solve", "the battery backup study").
 */
export function nonFiniteProblems(what: string, value: unknown, names?: ReadonlyMap<string, string>): Problem[] {
  const byElement = new Map<string, NonFiniteFigure[]>();
  for (const f of findNonFinite(value)) {
    const list = byElement.get(f.elementId);
    if (list) list.push(f);
    else byElement.set(f.elementId, [f]);
  }
  return [...byElement].map(([elementId, figures]) => {
    const first = figures[0]!;
    const name = names?.get(elementId) ?? first.elementName;
    const subject = elementId === PROJECT_LEVEL ? 'the project as a whole' : `"${name ?? elementId}"`;
    const fields = [...new Set(figures.map((f) => `${fieldWords(f.path)} (${valueWords(f.value)})`))];
    const listed = fields.slice(0, 3).join(', ') + (fields.length > 3 ? ` and ${fields.length - 3} more` : '');
    return {
      code: 'non-finite' as const,
      elementId,
      field: first.path.join('.'),
      value: String(first.value),
      message:
        `${what} gives figures for ${subject} that are not finite numbers: ${listed}. Nothing computed is shown. ` +
        (elementId === PROJECT_LEVEL
          ? "These figures follow from the elements' values and the project's settings: check those named beside this, and the settings."
          : 'A value of this element or of one it feeds is out of range (near zero or huge, or a unit slip): check them.'),
    };
  });
}

/** The names users gave the elements of a project given as untrusted data (id → name). */
export function elementNames(project: unknown): Map<string, string> {
  const names = new Map<string, string>();
  const elements = isRecord(project) ? project['elements'] : undefined;
  if (Array.isArray(elements)) {
    for (const e of elements) {
      if (isRecord(e) && typeof e['id'] === 'string' && typeof e['name'] === 'string' && e['name'] !== '') names.set(e['id'], e['name']);
    }
  }
  return names;
}
