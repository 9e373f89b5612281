/**
 * Load profiles on hostile input (issue 15, points 5, 7 and 9): a profile whose segments or duty
 * periods are very short is refused at its field, naming the limit, before anything is built (no
 * crash, no runaway memory); a profile key is looked up by own keys only, and a key that names no
 * element, or an element that is not a load, is refused at that field.
 *
 * The limits are the engine's own (core/solve/load-profile.ts, stated in core/studies/backup/README.md):
 * 100 000 load changes, 1 000 load states, 1 000 000 steps. The energies are worked by hand
 * (energy = Σ on-time × power).
 */
import { describe, expect, it } from 'vitest';
import { simulateDischarge } from '../../core/studies/backup/discharge.ts';
import { runBackupStudy } from '../../core/studies/backup/study.ts';
import { MAX_LOAD_CHANGES, MAX_LOAD_STATES, MAX_WHOLE_CHAIN_WORK, buildTimeline } from '../../core/solve/load-profile.ts';
import { demoProjects, type BackupStudy, type Project } from '../../core/index.ts';
import type { Problem } from '../../core/model/errors.ts';
import { findNonFinite } from '../../core/solve/finite.ts';
import { directLoad, flatBank } from './helpers.ts';
import { onSolved } from '../core/solved.ts';

type Json = Record<string, any>; // fixtures hold values the schema refuses on purpose

const demo = (): Json => structuredClone(demoProjects.find((d) => d.id === 'hillside-relay-hut')!.project) as Json;

/** The study's problems; fails when the study ran. */
function refused(p: unknown): Problem[] {
  const out = onSolved(simulateDischarge, p);
  expect(out.ok, 'the study must be refused').toBe(false);
  return out.ok ? [] : out.problems;
}

/** One problem at this field whose message matches. */
function refusedAt(p: unknown, field: string, says: RegExp): Problem {
  const problems = refused(p);
  expect(problems.map((x) => x.field)).toEqual([field]);
  expect(problems[0]!.message).toMatch(says);
  expect(problems[0]!.message).not.toMatch(/NaN|Infinity|undefined/);
  return problems[0]!;
}

describe('very short segments and duty periods are refused at their field, naming the limit', () => {
  it('two 1e-5 h segments repeating over the horizon (today: "Set maximum size exceeded")', () => {
    const p = demo();
    p.backup.profile = { kind: 'segments', repeat: true, segments: [{ durationHours: 1e-5, loads: { lights: 10 } }, { durationHours: 1e-5 }] };
    // 96 h ÷ 0.072 s × 2 segments = 9 600 000 load changes (by hand).
    const x = refusedAt(p, 'backup.profile.segments.0.durationHours', /9 600 000 times; a study holds at most 100 000 load changes: make segment 1 at least [\d.]+ s long/);
    expect(x.value).toBe(1e-5);
  });

  it('two 1e-7 h segments (today: the process runs out of memory) are refused at once, as is a segment of the smallest double', () => {
    for (const d of [1e-7, 5e-324]) {
      const p = demo();
      p.backup.profile = { kind: 'segments', repeat: true, segments: [{ durationHours: d, loads: { lights: 10 } }, { durationHours: d }] };
      refusedAt(p, 'backup.profile.segments.0.durationHours', /a study holds at most 100 000 load changes/);
    }
  });

  it('a duty period of 1e-6 min', () => {
    const p = demo();
    p.backup.profile.duty[0].periodMinutes = 1e-6;
    p.backup.profile.duty[0].onMinutes = 1e-7;
    // 96 h ÷ 6e-5 s × 2 switchings = 1.152e10 (by hand; the last digit is the rounding of the period).
    refusedAt(p, 'backup.profile.duty.0.periodMinutes', /switches the load 11 520 000 00\d times over the 96 h the study runs \(.* with the profile's other load changes\); a study holds at most 100 000 load changes: make the period at least [\d.]+ s/);
  });

  it('a daily profile with more segments than a year of days can hold', () => {
    const p = demo();
    p.backup.horizonHours = 8784;
    p.backup.profile = { kind: 'daily', segments: Array.from({ length: 300 }, (_, i) => ({ startHour: i * 0.08, loads: { lights: i % 7 } })) };
    // 300 segments × 367 days (the 366 of the horizon and the day before the start, as the timeline
    // lays them out) = 110 100 > 100 000 (by hand).
    refusedAt(p, 'backup.profile.segments', /300 segments a day over the 8784 h horizon change the load 110 100 times; a study holds at most 100 000/);
  });

  it('load changes from several sources are summed and the largest is named', () => {
    const p = demo();
    // Each alone within the limit: 2 × 96 h ÷ 12 s = 57 600 changes; two of them 115 200, and the
    // daily segments 3 × 6 days = 18 more: 115 218 (by hand). The room the others leave the first:
    // 100 000 − 57 618 = 42 382 changes, so a period of 2 × 96 h ÷ 42 382 = 16.309 s, 16.4 s rounded up.
    p.backup.profile.duty = [
      { load: 'fridge', periodMinutes: 0.2, onMinutes: 0.1 },
      { load: 'lights', periodMinutes: 0.2, onMinutes: 0.1, offsetMinutes: 0.02 },
    ];
    refusedAt(p, 'backup.profile.duty.0.periodMinutes', /57 600 times over the 96 h the study runs \(115 218 with the profile's other load changes\); a study holds at most 100 000 load changes: make the period at least 16.4 s/);
  });

  it('more load states than the limit: refused at the profile, naming the limit', () => {
    const p = demo();
    p.backup.profile = { kind: 'segments', segments: Array.from({ length: MAX_LOAD_STATES + 5 }, (_, i) => ({ durationHours: 0.05, loads: { lights: i } })) };
    p.backup.horizonHours = 8784;
    refusedAt(p, 'backup.profile', /more than 1 000 different combinations of load levels/);
  });

  it('the limits are far from a real profile: a pump on a 1-minute duty cycle for a week runs, and its energy is Σ on-time × power', () => {
    // 20 160 switchings (2 per minute for 168 h) + 1 segment, under MAX_LOAD_CHANGES.
    expect(2 * 168 * 60 + 1).toBeLessThan(MAX_LOAD_CHANGES);
    const p = directLoad(flatBank(5000, 20, 1), 50, {
      profile: { kind: 'segments', segments: [{ durationHours: 168 }], duty: [{ load: 'pump', periodMinutes: 1, onMinutes: 0.5 }] },
    }, [{ id: 'pump', kind: 'dc-load', from: 'bank', power: 100 }]);
    const out = onSolved(simulateDischarge, p);
    if (!out.ok) throw new Error(JSON.stringify(out.problems));
    expect(out.result.endReason).toBe('profile-complete');
    // 168 h × 50 W + 168 h × 0.5 × 100 W = 8400 + 8400 Wh (by hand).
    expect(out.result.loadWh).toBeCloseTo(16800, 6);
  });

  it('the whole study (discharge, sizing, sized discharge) is refused the same way', () => {
    const p = demo();
    p.backup.profile.duty[0].periodMinutes = 1e-6;
    p.backup.profile.duty[0].onMinutes = 1e-7;
    const out = onSolved(runBackupStudy, p);
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.problems.map((x) => x.field)).toEqual(['backup.profile.duty.0.periodMinutes']);
  });
});

describe('the study\'s other settings at the ends of their range', () => {
  it('a horizon of 1e-9 h with a 24 h target runtime is refused at the horizon (today the sizing repeated 3.6 µs to 24 h until the process ran out of memory)', () => {
    const p = demo();
    p.backup.horizonHours = 1e-9;
    const out = onSolved(runBackupStudy, p);
    expect(out.ok).toBe(false);
    if (!out.ok) {
      expect(out.problems.map((x) => x.field)).toEqual(['backup.horizonHours']);
      expect(out.problems[0]!.message).toMatch(/give a horizon at least as long as the target runtime/);
    }
  });

  it('a target runtime of 3000 h is sized (the sized run stays within the year a study runs); past a year it is refused at its field', () => {
    const p = demo();
    p.backup.targetRuntimeHours = 3000;
    const out = onSolved(runBackupStudy, p);
    if (!out.ok) throw new Error(JSON.stringify(out.problems));
    // 3000 h is over 100 times the 24 h the demo's own bank covers: far more strings.
    expect(out.study.sizing!.strings).toBeGreaterThan(100);
    const q = demo();
    q.backup.targetRuntimeHours = 9000;
    const refusedLong = onSolved(runBackupStudy, q);
    expect(refusedLong.ok).toBe(false);
    if (!refusedLong.ok) expect(refusedLong.problems.map((x) => x.field)).toEqual(['backup.targetRuntimeHours']);
  });

  it('a state of health of 5e-324 with a target runtime gives a finite study (the run to the target is made with a bank at full health)', () => {
    const p = demo();
    p.backup.stateOfHealth = 5e-324;
    const out = onSolved(runBackupStudy, p);
    if (!out.ok) throw new Error(JSON.stringify(out.problems));
    expect(findNonFinite(out.study)).toEqual([]);
  });

  it('a charger efficiency below 1 % is refused at its field (the charger\'s AC input, DC ÷ η, overflowed at 5e-324)', () => {
    const p = demo();
    p.backup.chargerEfficiency = 5e-324;
    const out = onSolved(runBackupStudy, p);
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.problems.map((x) => x.field)).toEqual(['backup.chargerEfficiency']);
  });

  it('a time step longer than the whole outage still runs it: 60 W from a flat 12 V, 100 Ah bank lasts 20 h at any step (by hand: 100 Ah × 12 V ÷ 60 W)', () => {
    for (const step of [60, 1e300]) {
      const out = onSolved(simulateDischarge, directLoad(flatBank(100, 20, 1), 60, { timeStepSeconds: step }));
      if (!out.ok) throw new Error(JSON.stringify(out.problems));
      expect(out.result.runtimeSeconds / 3600).toBeCloseTo(20, 9);
      expect(out.result.endReason).toBe('rated-capacity');
    }
  });
});

describe('profile keys', () => {
  it('a load level keyed "__proto__" is refused at its field (today the schema dropped it without a word)', () => {
    const p = demo();
    p.backup.profile.segments[0].loads = JSON.parse('{"__proto__": 50}');
    refusedAt(p, 'backup.profile.segments.0.loads.__proto__', /no element can have the id "__proto__"/);
  });

  it.each(['toString', 'constructor', 'hasOwnProperty', 'valueOf'])('a load level keyed "%s" is refused at its field', (key) => {
    const p = demo();
    p.backup.profile.segments[1].loads = { [key]: 50 };
    refusedAt(p, `backup.profile.segments.1.loads.${key}`, new RegExp(`no element can have the id "${key}"`));
  });

  it('a key that names no element, or an element that is not a load, is refused at that field', () => {
    const p = demo();
    p.backup.profile.segments[0].loads = { lights: 80, nowhere: 10 };
    refusedAt(p, 'backup.profile.segments.0.loads.nowhere', /no element has the id "nowhere"/);
    const q = demo();
    q.backup.profile.segments[2].loads = { bus: 10 };
    // The DC bus of the demo, by its name.
    refusedAt(q, 'backup.profile.segments.2.loads.bus', /"DC bus and shunt" is not a load/);
    const r = demo();
    r.backup.profile.duty[0].load = 'inverter';
    refusedAt(r, 'backup.profile.duty.0.load', /is not a load/);
  });

  it('a load level is read from the profile\'s own keys: a load the segment does not name stays at its rating', () => {
    // The timeline on its own (the ids are refused before a study, see tests/core/reserved-ids.test.ts):
    // a segment that names no load leaves every load at its rating, whatever the load is called.
    const project: Project = {
      format: 'joulepath-project',
      version: 2,
      name: 'own keys',
      elements: [
        { id: 'bank', kind: 'battery', voltage: 48, internalResistance: 0.01 },
        { id: 'valueOf', kind: 'dc-load', from: 'bank', power: 40 },
        { id: 'constructor', kind: 'dc-load', from: 'bank', power: 60 },
      ],
    };
    const study: BackupStudy = { profile: { kind: 'segments', segments: [{ durationHours: 1 }, { durationHours: 1, loads: { valueOf: 10 } }] } };
    const tl = buildTimeline(project, study);
    expect(tl.states).toEqual([
      [40, 60],
      [10, 60],
    ]);
  });
});

describe('a run that sweeps the whole chain at every step is bounded in steps × elements (issue 15, point 7)', () => {
  // A current load on the bank makes every step a whole-chain sweep (core/solve/repeat.ts); 49 small
  // loads and the 10 W load beside it make 52 elements with the bank. Limits: the engine's own MAX_WHOLE_CHAIN_WORK (core/solve/load-profile.ts).
  const withCurrentLoad = (study: Partial<BackupStudy>): Project => {
    const extra = Array.from({ length: 49 }, (_, i) => ({ id: `lamp${i}`, kind: 'dc-load', from: 'bank', power: 1 }) as const);
    return directLoad(flatBank(100, 20, 1.2), 10, study, [{ id: 'relay', kind: 'dc-current-load', from: 'bank', current: 0.5 }, ...extra]);
  };
  it('a year at 1-minute steps (525 600 steps × 52 elements) is refused at the time step, naming the limit and a step that fits', () => {
    const p = refusedAt(withCurrentLoad({ horizonHours: 8760, timeStepSeconds: 60 }), 'backup.timeStepSeconds', /20 000 000 element solves/);
    // 8760 h × 3600 s × 52 / 2e7 = 81.99 s → at least 82 s (hand-worked).
    expect(p.message).toMatch(/at least 82 s/);
    expect(MAX_WHOLE_CHAIN_WORK).toBe(20_000_000);
  });
  it('the same run at the step it names is within the limit and runs', () => {
    const out = onSolved(simulateDischarge, withCurrentLoad({ horizonHours: 8760, timeStepSeconds: 82 }));
    expect(out.ok ? [] : out.problems).toEqual([]);
  });
  it('the fast path (constant-power loads only) is not held to it', () => {
    const p = directLoad(flatBank(100, 20, 1.2), 10, { horizonHours: 8760, timeStepSeconds: 60 }, Array.from({ length: 60 }, (_, i) => ({ id: `lamp${i}`, kind: 'dc-load', from: 'bank', power: 1 })));
    const out = onSolved(simulateDischarge, p);
    expect(out.ok ? [] : out.problems).toEqual([]);
  });
});
