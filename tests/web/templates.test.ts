// Default elements of the chain editor (web/editor/templates.ts): every template offered after a
// port makes a chain the engine solves — alone, with a further offered element after it, and when
// added after, before or beside each element of the demo projects. The checks are behaviour (the
// engine's solve succeeds), not values from a source; the defaults themselves are common practice
// (no source).
import { describe, expect, it } from 'vitest';
import { KINDS, demoProjects, solveProject } from '../../core/index.ts';
import type { ElementKind } from '../../core/model/project.ts';
import {
  ADDABLE_KINDS,
  SOURCE_TEMPLATES,
  followsUsPractice,
  nominalOutput,
  nominalPorts,
  offeredTemplates,
  projectFrequency,
  DRIVE_RATINGS,
  driveRatingFor,
  motorRatedVoltage,
  templateFor,
  templatesAfter,
} from '../../web/editor/templates.ts';
import { registerMadeUpKinds } from '../core/made-up-kinds.ts';
import { addBranch, draft, insertAfter, insertBefore, loadProject, outcome, type DraftElement, type DraftProject } from '../../web/state/editor.ts';

const project = (elements: DraftElement[]): DraftProject => ({ format: 'joulepath-project', version: 2, name: 'test', elements });
const source = (key: string) => structuredClone(SOURCE_TEMPLATES.find((s) => s.key === key)!.element);

/** Small projects ending at a feeder whose output port is the one named. */
function feeders(): { label: string; project: DraftProject; feederId: string }[] {
  const out: { label: string; project: DraftProject; feederId: string }[] = [];
  for (const s of SOURCE_TEMPLATES) out.push({ label: s.label, project: project([structuredClone(s.element)]), feederId: s.element.id });
  out.push({ label: 'battery 12 V (voltage only)', project: project([{ id: 'b', kind: 'battery', voltage: 12.8, internalResistance: 0.005 }]), feederId: 'b' });
  // One stage of each converting kind after the source that suits it, then its output is the port.
  const after = (key: string, kind: ElementKind) => {
    const p = project([source(key)]);
    const root = p.elements[0]!;
    const port = nominalPorts(p).get(root.id)!;
    const t = templateFor(kind, { port, project: p, feeder: root })!;
    expect(t, `${kind} after ${key}`).not.toBeNull();
    p.elements.push({ ...t, from: root.id });
    out.push({ label: `${kind} after ${key}`, project: p, feederId: t.id });
  };
  after('battery-48', 'inverter');
  after('battery-48', 'dc-dc');
  after('battery-48', 'dc-bus');
  after('battery-48', 'cable');
  after('grid-1-230', 'rectifier');
  after('grid-3-400', 'transformer');
  after('grid-3-480-60', 'transformer');
  after('grid-1-240-60', 'transformer');
  after('grid-3-400', 'drive');
  after('grid-3-480-60', 'drive');
  after('grid-1-230', 'drive');
  after('grid-3-400', 'motor');
  after('grid-3-480-60', 'motor');
  after('grid-1-230', 'motor');
  after('grid-1-240-60', 'motor');
  after('grid-3-400', 'generic');
  after('grid-3-480-60', 'cable');
  return out;
}

function solves(p: DraftProject): string {
  const o = solveProject(p);
  return o.ok ? 'ok' : o.problems.map((x) => `${x.elementId}.${x.field}: ${x.message}`).join('; ');
}

describe('templates after every plausible feeding port', () => {
  it.each(feeders().map((f) => [f.label, f] as const))('%s: each offered template solves, alone and with an offered element after it', (_label, f) => {
    const port = nominalPorts(f.project).get(f.feederId);
    expect(port).toBeDefined();
    const feeder = f.project.elements.find((e) => e.id === f.feederId)!;
    const offered = templatesAfter({ port: port!, project: f.project, feeder });
    expect(offered.length).toBeGreaterThan(0);
    for (const { kind, element } of offered) {
      // The engine accepts the port kind for this element.
      expect(KINDS.get(kind)!.accepts(element as never)).toContain(port!.kind);
      const p1 = structuredClone(f.project);
      p1.elements.push({ ...element, id: `new-${kind}`, from: f.feederId });
      expect(solves(p1), `${kind} after ${f.label}`).toBe('ok');
      const out = nominalOutput(element, port!);
      if (!out) continue;
      const added = p1.elements.at(-1)!;
      for (const next of templatesAfter({ port: out, project: p1, feeder: added })) {
        const p2 = structuredClone(p1);
        p2.elements.push({ ...next.element, id: `next-${next.kind}`, from: added.id });
        expect(solves(p2), `${next.kind} after ${kind} after ${f.label}`).toBe('ok');
      }
    }
  });

  it('offers what each port kind can take and nothing else', () => {
    const kindsAt = (key: string) => {
      const p = project([source(key)]);
      return templatesAfter({ port: nominalPorts(p).get(p.elements[0]!.id)!, project: p }).map((t) => t.kind).sort();
    };
    expect(kindsAt('battery-48')).toEqual(['cable', 'dc-bus', 'dc-current-load', 'dc-dc', 'dc-load', 'generic', 'inverter', 'transfer-switch']);
    expect(kindsAt('grid-3-400')).toEqual(['ac-current-load', 'ac-load', 'ac-va-load', 'cable', 'drive', 'generic', 'motor', 'network-load', 'rectifier', 'transfer-switch', 'transformer']);
    const shaft = templatesAfter({ port: { kind: 'shaft' } }).map((t) => t.kind).sort();
    expect(shaft).toEqual(['fan', 'pump', 'shaft-load']);
    // Sources are never offered as a stage.
    for (const kind of ADDABLE_KINDS) expect(KINDS.get(kind)!.role).not.toBe('source');
  });

  it('a kind that cannot take the port has no template there', () => {
    expect(templateFor('inverter', { port: { kind: 'ac3', voltage: 400, frequency: 50 } })).toBeNull();
    expect(templateFor('dc-load', { port: { kind: 'ac1', voltage: 230, frequency: 50 } })).toBeNull();
    expect(templateFor('dc-current-load', { port: { kind: 'ac3', voltage: 400, frequency: 50 } })).toBeNull();
    expect(templateFor('ac-current-load', { port: { kind: 'dc', voltage: 48 } })).toBeNull();
    expect(templateFor('motor', { port: { kind: 'dc', voltage: 48 } })).toBeNull();
    expect(templateFor('pump', { port: { kind: 'dc', voltage: 48 } })).toBeNull();
    expect(templateFor('cable', { port: { kind: 'shaft' } })).toBeNull();
  });
});

describe('project conventions', () => {
  it('60 Hz and NEC conductors in a US project, 50 Hz and IEC otherwise', () => {
    const us = project([source('grid-3-480-60')]);
    const eu = project([source('grid-3-400')]);
    expect(followsUsPractice(us)).toBe(true);
    expect(followsUsPractice(eu)).toBe(false);
    expect(projectFrequency(us)).toBe(60);
    expect(projectFrequency(eu)).toBe(50);
    const cableUs = templateFor('cable', { port: { kind: 'ac3', voltage: 480, frequency: 60 }, project: us })!;
    const cableEu = templateFor('cable', { port: { kind: 'ac3', voltage: 400, frequency: 50 }, project: eu })!;
    expect((cableUs['conductor'] as { system: string }).system).toBe('nec');
    expect((cableEu['conductor'] as { system: string }).system).toBe('iec');
    expect(cableUs['length']).toBe(10); // demo default, common practice (no source)
  });

  it('an inverter after a DC port gives 230 V 50 Hz, or 120 V 60 Hz when the project is on 60 Hz', () => {
    const bank = project([source('battery-48')]);
    const inv = templateFor('inverter', { port: { kind: 'dc', voltage: 51.2 }, project: bank })!;
    expect([inv['outputVoltage'], inv['frequency'], inv['phases']]).toEqual([230, 50, 1]); // demo default, common practice (no source)
    const us = project([source('battery-48'), { id: 'inv', kind: 'inverter', from: 'bank', phases: 1, outputVoltage: 120, frequency: 60, loss: { model: 'constant', efficiency: 0.9 } }]);
    const inv2 = templateFor('inverter', { port: { kind: 'dc', voltage: 51.2 }, project: us })!;
    expect([inv2['outputVoltage'], inv2['frequency']]).toEqual([120, 60]); // demo default, common practice (no source)
  });

  it('a motor takes the IE3 preset on 50 Hz and NEMA Premium on 60 Hz; its shaft load fits it', () => {
    expect(templateFor('motor', { port: { kind: 'ac3', voltage: 400, frequency: 50 } })!['efficiencyClass']).toBe('IE3');
    expect(templateFor('motor', { port: { kind: 'ac3', voltage: 480, frequency: 60 } })!['efficiencyClass']).toBe('NEMA-premium');
    const small = { id: 'm', kind: 'motor', ratedOutput: 2200 } as DraftElement;
    // 70 % of a 2.2 kW rating, common practice (no source).
    expect(templateFor('shaft-load', { port: { kind: 'shaft' }, feeder: small })!['power']).toBe(1500);
  });

  it('every source template solves on its own', () => {
    for (const s of SOURCE_TEMPLATES) expect(solves(project([structuredClone(s.element)])), s.label).toBe('ok');
  });
});

describe('defaults taken from the chain', () => {
  /** The motor offered after `feederId` in `p`. */
  const motorAfter = (p: DraftProject, feederId: string) => offeredTemplates(p, 'branch', feederId).find((t) => t.kind === 'motor')!.element;
  const driveRated = (e: DraftElement) => (e['loss'] as { ratedPower: number }).ratedPower;

  it('a motor on a 480 V NEC feed is rated 460 V; on a 400 V IEC feed 400 V', () => {
    // NEC Table 430.250 column / NEMA MG 1 utilization voltage: a 480 V system's motors are rated 460 V.
    expect(motorAfter(project([source('grid-3-480-60')]), 'supply')['ratedVoltage']).toBe(460);
    // IEC 60038 system voltage 400 V: IEC motors are rated at it.
    expect(motorAfter(project([source('grid-3-400')]), 'supply')['ratedVoltage']).toBe(400);
    // 1φ: 230 V IEC system → 230 V; 120/240 V service (modelled at 240 V) → 230 V (NEC Table 430.248 column).
    expect(motorAfter(project([source('grid-1-230')]), 'supply')['ratedVoltage']).toBe(230);
    expect(motorAfter(project([source('grid-1-240-60')]), 'supply')['ratedVoltage']).toBe(230);
  });

  it('maps each North American system voltage to the motor voltage of the NEC tables, and keeps IEC voltages', () => {
    // NEC Tables 430.248 / 430.250 columns (115, 200, 230, 460, 575 V) against the system voltages
    // 120, 208, 240, 480, 600 V (NEMA MG 1 rated voltages).
    const us = (v: number) => motorRatedVoltage({ kind: 'ac3', voltage: v, frequency: 60 }, true);
    expect([120, 208, 240, 480, 600].map(us)).toEqual([115, 200, 230, 460, 575]);
    // A voltage the map does not hold is kept (from memory: 4160 V systems take 4000 V motors; not mapped here).
    expect(us(4160)).toBe(4160);
    // IEC 60038: 230 / 400 / 690 V motors on 230 / 400 / 690 V systems.
    expect([230, 400, 690].map((v) => motorRatedVoltage({ kind: 'ac3', voltage: v, frequency: 50 }, false))).toEqual([230, 400, 690]);
    expect(motorRatedVoltage({ kind: 'ac3', frequency: 50 }, false)).toBeUndefined();
  });

  it('a motor behind a drive takes the drive\'s supply voltage class, and behind a 208 V transformer 200 V', () => {
    const p = project([source('grid-3-480-60')]);
    const drive = offeredTemplates(p, 'branch', 'supply').find((t) => t.kind === 'drive')!.element;
    p.elements.push({ ...drive, from: 'supply' });
    // The drive's output follows its 480 V supply; NEC Table 430.250: 460 V motor.
    expect(drive['outputVoltage']).toBe(480);
    expect(motorAfter(p, 'drive')['ratedVoltage']).toBe(460);
    const q = project([source('grid-3-480-60')]);
    const tx = offeredTemplates(q, 'branch', 'supply').find((t) => t.kind === 'transformer')!.element;
    q.elements.push({ ...tx, from: 'supply' });
    // NEMA MG 1 / NEC Table 430.250: a 208 V system's motors are rated 200 V.
    expect(motorAfter(q, 'transformer')['ratedVoltage']).toBe(200);
    expect(solveProject({ ...q, elements: [...q.elements, { ...motorAfter(q, 'transformer'), from: 'transformer' }] } as never).ok).toBe(true);
  });

  it('a drive inserted in front of a 22 kW motor is rated 22 kW (the next listed rating, never smaller)', () => {
    const p = project([source('grid-3-400'), { id: 'm', kind: 'motor', from: 'supply', ratedOutput: 22000, efficiencyClass: 'IE3', poles: 4, ratedFrequency: 50 }]);
    // IEC motor rating series (common practice (no source)): 22 kW is listed, so the drive is 22 kW, not the 11 kW preset.
    const before = offeredTemplates(p, 'before', 'm').find((t) => t.kind === 'drive')!.element;
    expect(driveRated(before)).toBe(22000);
    // Inserted after the supply (between it and the motor): the same.
    expect(driveRated(offeredTemplates(p, 'after', 'supply').find((t) => t.kind === 'drive')!.element)).toBe(22000);
    // A new branch feeds no motor: the 11 kW preset (demo default, common practice (no source)).
    expect(driveRated(offeredTemplates(p, 'branch', 'supply').find((t) => t.kind === 'drive')!.element)).toBe(11000);
    // Through a cable, and a rating between the listed ones: 20 kW → 22 kW; 400 kW (above the list) → 400 kW.
    const q = project([
      source('grid-3-400'),
      { id: 'run', kind: 'cable', from: 'supply', length: 10, resistancePerKm: 0.5 },
      { id: 'm', kind: 'motor', from: 'run', ratedOutput: 20000, efficiencyClass: 'IE3', poles: 4, ratedFrequency: 50 },
    ]);
    expect(driveRated(offeredTemplates(q, 'before', 'run').find((t) => t.kind === 'drive')!.element)).toBe(22000);
    expect(driveRatingFor(400000)).toBe(400000);
    expect(driveRatingFor(370)).toBe(370);
    // The series runs 0.37 … 355 kW (IEC motor ratings, common practice (no source)).
    expect([DRIVE_RATINGS[0], DRIVE_RATINGS.at(-1)]).toEqual([370, 355000]);
    // The chain with the sized drive solves.
    loadProject(p, { kind: 'new', title: 'drive in front' });
    expect(insertBefore('m', before).ok).toBe(true);
    expect(outcome.value!.ok).toBe(true);
  });

  it('a motor added after a drive the user rated 5.5 kW is at most 5.5 kW; the drive is left as set', () => {
    const p = project([
      source('grid-3-400'),
      { id: 'vfd', kind: 'drive', from: 'supply', outputVoltage: 400, outputFrequency: 50, inputPowerFactor: 0.95, loss: { model: 'constant', efficiency: 0.97, ratedPower: 5500 } },
    ]);
    // IEC motor rating series (common practice (no source)): the largest at or below 5.5 kW is 5.5 kW (the preset is 7.5 kW).
    expect(motorAfter(p, 'vfd')['ratedOutput']).toBe(5500);
    expect(driveRated(p.elements[1]!)).toBe(5500);
    // On 60 Hz the NEMA hp series (NEMA MG 1 ratings, from memory): 7.5 hp = 5.59 kW is above 5.5 kW, so 5 hp = 3728.5 W.
    const us = project([
      source('grid-3-480-60'),
      { id: 'vfd', kind: 'drive', from: 'supply', outputVoltage: 480, outputFrequency: 60, inputPowerFactor: 0.95, loss: { model: 'constant', efficiency: 0.97, ratedPower: 5500 } },
    ]);
    expect(motorAfter(us, 'vfd')['ratedOutput']).toBe(3728.5);
    // Behind the 11 kW preset drive the 7.5 kW preset motor stays (demo default, common practice (no source)).
    expect(motorAfter(project([source('grid-3-400'), { ...p.elements[1]!, loss: { model: 'constant', efficiency: 0.97, ratedPower: 11000 } }]), 'vfd')['ratedOutput']).toBe(7500);
  });
});

describe('templates offered in the demo projects', () => {
  const cases = demoProjects.flatMap((demo) =>
    (['after', 'branch', 'before'] as const).map((op) => [demo.id, op, demo] as const),
  );
  it.each(cases)('%s: every template offered %s every element keeps the chain solving', (_id, op, demo) => {
    const base = demo.project as unknown as DraftProject;
    let tried = 0;
    for (const target of base.elements) {
      for (const { kind, element } of offeredTemplates(base, op, target.id)) {
        loadProject(base, { kind: 'demo', title: demo.title });
        const r = op === 'after' ? insertAfter(target.id, element) : op === 'branch' ? addBranch(target.id, element) : insertBefore(target.id, element);
        expect(r.ok).toBe(true);
        const o = outcome.value!;
        const why = o.ok ? 'ok' : 'problems' in o ? o.problems.map((p) => `${p.elementId}.${p.field}: ${p.message}`).join('; ') : o.crashed;
        expect(why, `${kind} ${op} ${target.id} in ${demo.id}`).toBe('ok');
        expect(draft.value!.elements.length).toBe(base.elements.length + 1);
        tried++;
      }
    }
    expect(tried).toBeGreaterThan(0);
  });

  it('nothing is offered after a load, and no load is offered where it would have to feed something', () => {
    const hut = demoProjects.find((d) => d.id === 'hillside-relay-hut') ?? demoProjects[0]!;
    const p = hut.project as unknown as DraftProject;
    const load = p.elements.find((e) => KINDS.get(e.kind as ElementKind)!.role === 'load')!;
    expect(offeredTemplates(p, 'after', load.id)).toEqual([]);
    expect(offeredTemplates(p, 'branch', load.id)).toEqual([]);
    const before = offeredTemplates(p, 'before', load.id);
    expect(before.length).toBeGreaterThan(0);
    for (const t of before) expect(KINDS.get(t.kind)!.role).not.toBe('load');
    // Before the source nothing can go.
    expect(offeredTemplates(p, 'before', p.elements.find((e) => e.from === undefined)!.id)).toEqual([]);
  });
});

describe('a made-up kind (tests/core/made-up-kinds.ts): the templates read its nominal output from the registry', () => {
  it('what it feeds is offered at its own set point, and the nominal ports pass through it', () => {
    const off = registerMadeUpKinds();
    try {
      // A 230 V supply, the made-up regulator at 24 V (its own definition), a cable after it.
      const p = project([
        structuredClone(source('grid-1-230')),
        { id: 'reg', kind: 'test-regulator', from: 'supply', outputVoltage: 24, efficiency: 0.9 },
        { id: 'run', kind: 'cable', from: 'reg', length: 5, resistancePerKm: 7.41 },
      ]);
      const ports = nominalPorts(p);
      expect(ports.get('reg')).toEqual({ kind: 'dc', voltage: 24 }); // its nominalOutput trait
      expect(ports.get('run')).toEqual({ kind: 'dc', voltage: 24 }); // a cable passes its port on
      const offered = offeredTemplates(p, 'branch', 'reg').map((t) => t.kind);
      expect(offered).toContain('dc-load');
      expect(offered).toContain('inverter');
      expect(offered).not.toContain('ac-load');
      // A 24 V port gets the 12 V DC-DC template (the templates' rule for ports above 14 V).
      expect(offeredTemplates(p, 'branch', 'reg').find((t) => t.kind === 'dc-dc')!.element['outputVoltage']).toBe(12);
      // Each offered element solves behind the made-up kind.
      for (const t of offeredTemplates(p, 'branch', 'run')) {
        const next = project([...p.elements, { ...t.element, id: 'new', from: 'run' }]);
        expect(solveProject(next).ok, t.kind).toBe(true);
      }
    } finally {
      off();
    }
  });
});
