// What the app exports, it imports (issue 15, point 4): every limit the import checks
// (web/storage/limits.ts, read by file-format.ts and by the editor) is enforced while editing, so no
// sequence of accepted edits makes a file the import refuses. The limits are this format's own rules:
// common practice (no source). The chains are invented test data.
import { beforeEach, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { PROJECT_LEVEL } from '../../core/model/errors.ts';
import {
  addBranch,
  canUndo,
  draft,
  duplicate,
  edit,
  fieldError,
  freshId,
  insertAfter,
  insertBefore,
  lastChange,
  loadProject,
  newProject,
  removeElement,
  setField,
  type DraftElement,
  type DraftProject,
} from '../../web/state/editor.ts';
import { IMPORT_LIMITS, buildExport, exportText, parseImportText } from '../../web/storage/file-format.ts';
import { scanLimits } from '../../web/storage/limits.ts';

const loss = { model: 'constant', efficiency: 0.95 };
/** bank → cable → inverter → fridge; bank → dc-dc → radio (with a simple network load on the inverter). */
function chain(): DraftProject {
  return structuredClone<DraftProject>({
    format: 'joulepath-project',
    version: 2,
    name: 'limits chain',
    elements: [
      { id: 'bank', kind: 'battery', voltage: 51.2, internalResistance: 0.01 },
      { id: 'cab', kind: 'cable', from: 'bank', length: 3, resistancePerKm: 0.5 },
      { id: 'inv', kind: 'inverter', from: 'cab', phases: 1, outputVoltage: 230, frequency: 50, loss: { ...loss } },
      { id: 'fridge', kind: 'ac-load', from: 'inv', power: 150, powerFactor: 0.8 },
      { id: 'dc-dc', kind: 'dc-dc', from: 'bank', outputVoltage: 12, loss: { ...loss } },
      { id: 'radio', kind: 'dc-load', from: 'dc-dc', power: 40 },
    ],
  });
}

const lamp: DraftElement = { id: 'lamp', kind: 'dc-load', power: 5 };

/** The project as exported, then imported again: the import's verdict. */
function roundTrip(project: DraftProject) {
  return parseImportText(exportText(buildExport(project, { exportedAt: new Date(Date.UTC(2026, 0, 1)), appVersion: 'test', projectId: 'abc-123' })));
}

/** An object nested `depth` levels deep ({ series: [{ series: [ … ] }] } counts two levels per step). */
function nested(depth: number): unknown {
  let at: unknown = { resistor: '10 Ω' };
  for (let i = 0; i < depth; i++) at = { x: at };
  return at;
}

/** A wide chain of `count` elements: one bank feeding count − 1 small DC loads. */
function wide(count: number): DraftProject {
  const elements: DraftElement[] = [{ id: 'bank', kind: 'battery', voltage: 48, internalResistance: 0.01 }];
  for (let i = 1; i < count; i++) elements.push({ id: `l${i}`, kind: 'dc-load', from: 'bank', power: 1 });
  return { format: 'joulepath-project', version: 2, name: 'wide', elements };
}

beforeEach(() => {
  loadProject(chain(), { kind: 'new', title: 'test' });
});

describe('a field edit past a limit of the project file is refused at the field', () => {
  const cases: [string, string, string, unknown, RegExp][] = [
    ['a number larger than 1e15 (SI)', 'cab', 'length', 2e15, /larger than any value in a power chain/],
    ['a negative number past -1e15', 'bank', 'voltage', -5e15, /larger than any value/],
    ['an element name of 20 001 characters', 'cab', 'name', 'x'.repeat(IMPORT_LIMITS.maxStringLength + 1), /too long.*at most 20.000 characters/],
    ['a description of 20 001 characters', PROJECT_LEVEL, 'description', 'd'.repeat(IMPORT_LIMITS.maxStringLength + 1), /at most 20.000 characters/],
    ['a project name of 201 characters', PROJECT_LEVEL, 'name', 'n'.repeat(201), /project name holds at most 200 characters/],
    ['a network nested 40 levels deep', 'fridge', 'network', nested(40), /more than 32 levels deep/],
    ['a key of 201 characters', 'fridge', 'network', { ['k'.repeat(201)]: 1 }, /names of at most 200/],
    ['a "__proto__" key (as JSON.parse makes it)', 'fridge', 'network', JSON.parse('{"__proto__":{"resistor":"1 Ω"}}'), /"__proto__" cannot be used/],
  ];

  it.each(cases)('%s', (_label, id, path, value, words) => {
    const before = structuredClone(draft.value);
    const message = setField(id, path, value);
    expect(message).toMatch(words);
    expect(fieldError(id, path)).toBe(message);
    expect(draft.value).toEqual(before);
    expect(canUndo.value).toBe(false);
  });

  it('a value at the limit is taken in and the file reads back', () => {
    expect(setField('cab', 'name', 'x'.repeat(IMPORT_LIMITS.maxStringLength))).toBeNull();
    expect(setField(PROJECT_LEVEL, 'name', 'n'.repeat(IMPORT_LIMITS.maxProjectNameLength))).toBeNull();
    const back = roundTrip(draft.value!);
    expect(back.ok).toBe(true);
  });

  it('nesting is counted as the import counts it: the deepest the file holds is taken in, one more is not', () => {
    // The element sits at depth 3 of the export (envelope → project → elements → [i]); `extra` at 4;
    // nested(d) puts its innermost text at depth 5 + d, and the file holds depth 32: d = 27 fits.
    const put = (d: number) => edit('nest', (p) => {
      p.elements.find((e) => e.id === 'radio')!['extra'] = nested(d);
    });
    expect(put(28)).toMatch(/more than 32 levels deep/);
    expect(put(27)).toBeNull();
    expect(roundTrip(draft.value!).ok).toBe(true);
  });

  it('values are counted as the import counts them: the editor takes in exactly the largest table the file holds', () => {
    const rows = (n: number) => Array.from({ length: n }, (_v, i) => ({ load: i / 1e6, efficiency: 0.9 }));
    const withRows = (n: number) => {
      const p = chain();
      (p.elements.find((e) => e.id === 'dc-dc')!['loss'] as Record<string, unknown>)['points'] = rows(n);
      return p;
    };
    // Each row adds 3 values (the row and its two numbers): from the count of a one-row file, the
    // largest table the file holds; the import's own verdict confirms it on both sides.
    const exported = (n: number) => exportText(buildExport(withRows(n), { exportedAt: new Date(Date.UTC(2026, 0, 1)), appVersion: 'test', projectId: 'abc-123' }));
    const one = scanLimits(JSON.parse(exported(1))).count;
    const lo = 1 + Math.floor((IMPORT_LIMITS.maxValues - one) / 3);
    expect(parseImportText(exported(lo)).ok).toBe(true);
    expect(parseImportText(exported(lo + 1)).ok).toBe(false);
    const put = (n: number) => {
      loadProject(chain(), { kind: 'new', title: 'rows' });
      return edit('rows', (p) => {
        (p.elements.find((e) => e.id === 'dc-dc')!['loss'] as Record<string, unknown>)['points'] = rows(n);
      });
    };
    expect(put(lo)).toBeNull();
    expect(roundTrip(draft.value!).ok).toBe(true);
    expect(put(lo + 1)).toMatch(/more than 200.000 values/);
  }, 30_000);

  it('a table grown past the file\'s value count is refused, the draft unchanged', () => {
    const before = draft.value;
    const rows = Array.from({ length: IMPORT_LIMITS.maxValues / 2 }, (_v, i) => ({ load: i / 1e5, efficiency: 0.9 }));
    const message = edit('many rows', (p) => {
      (p.elements.find((e) => e.id === 'dc-dc')!['loss'] as Record<string, unknown>)['points'] = rows;
    });
    expect(message).toMatch(/more than 200.000 values/);
    expect(draft.value).toBe(before);
    expect(lastChange.value).toBe(message);
  });
});

describe('adding elements stops at the element limit with a message', () => {
  it('add, insert after, insert before and duplicate are refused at 2000 elements', () => {
    loadProject(wide(IMPORT_LIMITS.maxElements), { kind: 'new', title: 'wide' });
    const before = draft.value;
    for (const op of [() => addBranch('bank', lamp), () => insertAfter('l5', lamp), () => insertBefore('l5', lamp), () => duplicate('l5')]) {
      const r = op();
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.message).toMatch(/at most 2000 elements/);
      expect(draft.value).toBe(before);
    }
    // Removing one makes room for one.
    expect(removeElement('l7').ok).toBe(true);
    expect(addBranch('bank', lamp).ok).toBe(true);
    expect(draft.value!.elements).toHaveLength(IMPORT_LIMITS.maxElements);
    expect(roundTrip(draft.value!).ok).toBe(true);
  });

  it('a duplicate whose copies would pass the limit is refused whole', () => {
    const p = wide(IMPORT_LIMITS.maxElements - 5);
    // bank → hub → 2 loads (1998 elements): duplicating hub adds 3 where 2 fit.
    p.elements.push({ id: 'hub', kind: 'cable', from: 'bank', length: 1, resistancePerKm: 1 });
    for (let i = 0; i < 2; i++) p.elements.push({ id: `h${i}`, kind: 'dc-load', from: 'hub', power: 1 });
    loadProject(p, { kind: 'new', title: 'near' });
    expect(draft.value!.elements).toHaveLength(IMPORT_LIMITS.maxElements - 2);
    const r = duplicate('hub');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/adds 3 elements.*at most 2000/);
  });
});

describe('what an edit makes of ids and names stays within the file\'s limits', () => {
  it('a fresh id made from a 100-character id is at most 100 characters', () => {
    const long = 'c'.repeat(IMPORT_LIMITS.maxIdLength);
    const p = chain();
    p.elements.push({ id: long, kind: 'dc-load', from: 'dc-dc', power: 2 });
    loadProject(p, { kind: 'new', title: 'long id' });
    expect(freshId(draft.value!, long).length).toBeLessThanOrEqual(IMPORT_LIMITS.maxIdLength);
    expect(duplicate(long).ok).toBe(true);
    expect(draft.value!.elements.every((e) => e.id.length <= IMPORT_LIMITS.maxIdLength)).toBe(true);
    expect(roundTrip(draft.value!).ok).toBe(true);
  });

  it('a new project named past the project-name limit gets a name the import reads', () => {
    newProject('n'.repeat(300), { id: 'bank', kind: 'battery', voltage: 48, internalResistance: 0.01 });
    expect(draft.value!.name).toHaveLength(IMPORT_LIMITS.maxProjectNameLength);
    expect(roundTrip(draft.value!).ok).toBe(true);
  });

  it('a copy of an element whose name is at the text limit keeps a name the import reads', () => {
    expect(setField('radio', 'name', 'r'.repeat(IMPORT_LIMITS.maxStringLength))).toBeNull();
    expect(duplicate('radio').ok).toBe(true);
    const copy = draft.value!.elements.at(-1)!;
    expect(copy.name).toMatch(/ \(copy\)$/);
    expect((copy.name as string).length).toBeLessThanOrEqual(IMPORT_LIMITS.maxStringLength);
    expect(roundTrip(draft.value!).ok).toBe(true);
  });
});

describe('export → import round-trips after any sequence of accepted edits (fast-check)', () => {
  const ids = () => draft.value!.elements.map((e) => e.id);
  const hostileValue = fc.oneof(
    fc.double(),
    fc.constantFrom(1e15, -1e15, 1.0000001e15, 1e300, -1e300, 5e-324, -0, 0, Infinity, NaN),
    fc.string(),
    fc.integer({ min: IMPORT_LIMITS.maxStringLength - 3, max: IMPORT_LIMITS.maxStringLength + 3 }).map((n) => 'é'.repeat(n)),
    fc.integer({ min: 25, max: 35 }).map(nested),
    fc.integer({ min: 195, max: 205 }).map((n) => ({ ['k'.repeat(n)]: 1 })),
    fc.constantFrom('__proto__', 'constructor', 'prototype').map((k) => JSON.parse(`{"${k}":{"resistor":"1 Ω"}}`) as unknown),
    fc.jsonValue({ maxDepth: 4 }),
    fc.constant(undefined),
  );
  const paths = fc.constantFrom('name', 'power', 'length', 'voltage', 'loss.efficiency', 'network', 'extra.deep', 'loss.points');
  const command = fc.oneof(
    fc.record({ op: fc.constant('field' as const), pick: fc.nat(), path: paths, value: hostileValue }),
    fc.record({ op: fc.constant('project' as const), path: fc.constantFrom('name', 'description', 'dropLimits.totalPercent', 'note'), value: hostileValue }),
    fc.record({ op: fc.constantFrom('branch' as const, 'after' as const, 'before' as const, 'duplicate' as const, 'remove' as const), pick: fc.nat() }),
  );

  it('every exported draft is a file the import accepts, holding the same project', () => {
    fc.assert(
      fc.property(fc.array(command, { maxLength: 12 }), (commands) => {
        loadProject(chain(), { kind: 'new', title: 'fuzz' });
        for (const c of commands) {
          if (c.op === 'project') {
            setField(PROJECT_LEVEL, c.path, c.value);
            continue;
          }
          const all = ids();
          const id = all[c.pick % all.length]!;
          if (c.op === 'field') setField(id, c.path, c.value);
          else if (c.op === 'branch') addBranch(id, lamp);
          else if (c.op === 'after') insertAfter(id, lamp);
          else if (c.op === 'before') insertBefore(id, lamp);
          else if (c.op === 'duplicate') duplicate(id);
          else removeElement(id);
        }
        const back = roundTrip(draft.value!);
        if (!back.ok) throw new Error(`the import refused an exported draft: ${back.message}`);
        expect(back.project).toEqual(JSON.parse(JSON.stringify(draft.value)));
      }),
      { numRuns: 150 },
    );
  });
});
