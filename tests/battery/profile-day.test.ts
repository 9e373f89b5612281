/**
 * The load profile's day (core/studies/backup/profile-day.ts) and a load's level as a share of its
 * rating (`{ percent }`, core/model/study-settings.ts LoadSetting): hand-worked days, the percent
 * level run through the discharge study, its range, and a property: the day's energy is the sum of
 * each segment's power times its length.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { demoProjects } from '../../core/index.ts';
import { backupSettingsProblems, profileDay } from '../../core/studies/backup/profile-day.ts';
import { runBackupStudy } from '../../core/studies/backup/study.ts';
import { validateProject } from '../../core/solve/validate.ts';
import type { DailySegment, LoadSetting, Project } from '../../core/model/project.ts';
import { onSolved, solvedOf } from '../core/solved.ts';

type Json = Record<string, any>; // the demo as plain data, changed per case

const hillside = demoProjects.find((d) => d.id === 'hillside-relay-hut')!.project as unknown as Json;

/** The hillside hut (a 150 W vaccine fridge, 220 W of lights and sockets, 85 W of radios) with another profile. */
function hutWith(profile: Json, extra: Json = {}): Project {
  return { ...structuredClone(hillside), backup: { ...structuredClone(hillside['backup']), profile, ...extra } } as Project;
}

/**
 * The fridge-and-lights day: the fridge (150 W) cycling 12 min in every 30, the lights at 40 W from
 * 18:00 to 06:00 and off by day, the radios off.
 */
const fridgeAndLights = {
  kind: 'daily',
  startHour: 18,
  segments: [
    { startHour: 6, loads: { lights: false, radios: false } },
    { startHour: 18, loads: { lights: 40, radios: false } },
  ],
  duty: [{ load: 'fridge', periodMinutes: 30, onMinutes: 12 }],
};

describe('the day of a load profile', () => {
  it('fridge cycling 12 min in 30 plus 40 W of lights 18:00–06:00: energy, average and peak worked by hand', () => {
    const project = hutWith(fridgeAndLights);
    const out = profileDay(project, project.backup);
    if (!out.ok) throw new Error(JSON.stringify(out.problems));
    // Worked by hand (E = Σ P·Δt): the fridge is on 12/30 of the day, 150 W × 24 h × 0.4 = 1440 Wh
    // (48 cycles × 0.2 h × 150 W); the lights 40 W × 12 h = 480 Wh; the day 1920 Wh, on average
    // 1920 Wh ÷ 24 h = 80 W; the peak is the fridge on with the lights, 150 + 40 = 190 W.
    expect(out.day.energyWh).toBeCloseTo(1920, 9);
    expect(out.day.averageW).toBeCloseTo(80, 9);
    expect(out.day.peakW).toBeCloseTo(190, 9);
    expect(out.day.startHour).toBe(18);
    // On the clock: the day covered once from 0 to 24 h, and at 12:00 only the fridge cycles (0 or 150 W).
    expect(out.day.intervals[0]!.fromHour).toBe(0);
    expect(out.day.intervals.at(-1)!.toHour).toBeCloseTo(24, 12);
    const total = out.day.intervals.reduce((t, iv) => t + (iv.toHour - iv.fromHour), 0);
    expect(total).toBeCloseTo(24, 9);
    const noon = out.day.intervals.filter((iv) => iv.fromHour >= 11 && iv.toHour <= 13).map((iv) => iv.watts);
    expect(new Set(noon)).toEqual(new Set([0, 150]));
    // The duty counts from the outage's start (18:00): the fridge is on from 18:00 to 18:12.
    const at18 = out.day.intervals.find((iv) => iv.fromHour <= 18 && iv.toHour > 18)!;
    expect(at18.fromHour).toBeCloseTo(18, 12);
    expect(at18.toHour).toBeCloseTo(18.2, 12);
    expect(at18.watts).toBe(190);
  });

  it('an apparent-power load counts at its power factor; a current load only with a solved result', () => {
    // Worked by hand: 500 VA × 0.8 = 400 W (P = S·pf); 2 A into a DC load of the hut at its solved voltage.
    const project = structuredClone(hillside) as Json;
    project['elements'].push({ id: 'pump', name: 'Water pump', kind: 'ac-va-load', from: 'hut-cable', apparentPower: 500, powerFactor: 0.8 });
    project['elements'].push({ id: 'heater', name: 'Heater', kind: 'dc-current-load', from: 'bus', current: 2 });
    project['backup'] = { profile: { kind: 'constant' } };
    const without = profileDay(project as Project, project['backup']);
    if (!without.ok) throw new Error(JSON.stringify(without.problems));
    // 150 + 220 + 85 + 400 W, the heater not counted without a solved result.
    expect(without.day.averageW).toBeCloseTo(855, 9);
    expect(without.day.uncounted).toEqual(['heater']);
    const solved = solvedOf(project);
    const bus = solved.result.elements.find((e) => e.id === 'heater')!;
    const withResult = profileDay(project as Project, project['backup'], solved.result);
    if (!withResult.ok) throw new Error(JSON.stringify(withResult.problems));
    expect(withResult.day.uncounted).toEqual([]);
    // The heater draws V·I at its solved voltage (constant-current model): 2 A × that voltage.
    expect(withResult.day.averageW).toBeCloseTo(855 + 2 * bus.input!.voltage, 6);
  });

  it('refuses what the study would refuse, at the field', () => {
    const bad = hutWith({ kind: 'daily', segments: [{ startHour: 18 }, { startHour: 6 }] });
    const out = profileDay(bad, bad.backup);
    expect(out.ok).toBe(false);
    if (out.ok) return;
    expect(out.problems.map((p) => p.field)).toEqual(['backup.profile.segments.1.startHour']);
    const duty = hutWith({ kind: 'constant', duty: [{ load: 'fridge', periodMinutes: 30, onMinutes: 40 }] });
    expect(backupSettingsProblems(duty, duty.backup).map((p) => p.field)).toEqual(['backup.profile.duty.0.onMinutes']);
  });
});

describe('a load level as a share of its rating', () => {
  it('50 % of the 220 W lights is 110 W: the same day and the same runtime as 110 W typed in W', () => {
    const inPercent = hutWith({ kind: 'daily', segments: [{ startHour: 0, loads: { lights: { percent: 50 } } }] });
    const inWatts = hutWith({ kind: 'daily', segments: [{ startHour: 0, loads: { lights: 110 } }] });
    const a = profileDay(inPercent, inPercent.backup);
    const b = profileDay(inWatts, inWatts.backup);
    if (!a.ok || !b.ok) throw new Error('refused');
    // 150 + 110 + 85 = 345 W all day: 345 × 24 = 8280 Wh (hand arithmetic).
    expect(a.day.energyWh).toBeCloseTo(8280, 9);
    expect(a.day).toEqual(b.day);
    const ra = onSolved(runBackupStudy, inPercent);
    const rb = onSolved(runBackupStudy, inWatts);
    if (!ra.ok || !rb.ok) throw new Error('the study refused');
    expect(ra.study.discharge.runtimeSeconds).toBe(rb.study.discharge.runtimeSeconds);
    // And it is longer than with the lights at their full 220 W (a choice the level changes).
    const full = onSolved(runBackupStudy, hutWith({ kind: 'constant' }));
    if (!full.ok) throw new Error('the study refused');
    expect(ra.study.discharge.runtimeSeconds).toBeGreaterThan(full.study.discharge.runtimeSeconds);
  });

  it('is 0 to 100 %: above the rating or below zero is refused at the load, naming the share', () => {
    // 0…100 % by design (study-settings.ts LoadPercent): the element's value is the load's full draw.
    for (const percent of [120, -5]) {
      const project = hutWith({ kind: 'daily', segments: [{ startHour: 0, loads: { lights: { percent } } }] });
      const v = validateProject(project);
      expect(v.ok).toBe(false);
      if (v.ok) continue;
      expect(v.problems[0]!.field).toBe('backup.profile.segments.0.loads.lights.percent');
      expect(v.problems[0]!.message).toMatch(percent > 100 ? /must not exceed 100 %/ : /must not be negative/);
    }
    for (const percent of [0, 100, 37.5]) {
      expect(validateProject(hutWith({ kind: 'daily', segments: [{ startHour: 0, loads: { lights: { percent } } }] })).ok).toBe(true);
    }
  });
});

describe('property: the energy of a day is Σ segments’ power × time', () => {
  const LOADS = [
    { id: 'fridge', rated: 150 },
    { id: 'lights', rated: 220 },
    { id: 'radios', rated: 85 },
  ];
  const setting: fc.Arbitrary<LoadSetting> = fc.oneof(
    fc.boolean(),
    fc.integer({ min: 0, max: 400 }),
    fc.integer({ min: 0, max: 100 }).map((percent) => ({ percent })),
  );
  const level = (rated: number, s: LoadSetting | undefined) => (s === undefined || s === true ? rated : s === false ? 0 : typeof s === 'number' ? s : (rated * s.percent) / 100);
  // Start hours on quarter hours; duty periods that divide a quarter hour (5 or 15 min) from the
  // outage's start, itself on a quarter hour: each segment then holds whole periods, so a load on a
  // duty is on for on ÷ period of every segment (exact arithmetic, no time step).
  const day = fc.record({
    starts: fc.uniqueArray(fc.integer({ min: 0, max: 95 }), { minLength: 1, maxLength: 6 }).map((q) => [...q].sort((a, b) => a - b).map((x) => x / 4)),
    settings: fc.array(fc.dictionary(fc.constantFrom('fridge', 'lights', 'radios'), setting), { minLength: 6, maxLength: 6 }),
    outageStart: fc.integer({ min: 0, max: 95 }).map((x) => x / 4),
    duty: fc.option(fc.record({ load: fc.constantFrom('fridge', 'lights', 'radios'), period: fc.constantFrom(5, 15), on: fc.integer({ min: 0, max: 5 }) }), { nil: undefined }),
  });
  it('for random daily profiles with W, % and on/off levels and a duty cycle', () => {
    fc.assert(
      fc.property(day, ({ starts, settings, outageStart, duty }) => {
        const segments: DailySegment[] = starts.map((startHour, i) => ({ startHour, loads: settings[i]! }));
        const dutySchedule = duty ? [{ load: duty.load, periodMinutes: duty.period, onMinutes: Math.min(duty.on, duty.period) }] : [];
        const project = hutWith({ kind: 'daily', startHour: outageStart, segments, duty: dutySchedule });
        const out = profileDay(project, project.backup);
        if (!out.ok) throw new Error(JSON.stringify(out.problems));
        // By hand: each segment lasts to the next one's start (the last to the first's, a day later).
        let expected = 0;
        segments.forEach((s, i) => {
          const next = i + 1 < segments.length ? segments[i + 1]!.startHour : segments[0]!.startHour + 24;
          const hours = next - s.startHour;
          const watts = LOADS.reduce((t, l) => {
            const share = dutySchedule.length && dutySchedule[0]!.load === l.id ? dutySchedule[0]!.onMinutes / dutySchedule[0]!.periodMinutes : 1;
            return t + level(l.rated, Object.hasOwn(s.loads!, l.id) ? s.loads![l.id] : undefined) * share;
          }, 0);
          expected += watts * hours;
        });
        expect(out.day.energyWh).toBeCloseTo(expected, 6);
        expect(out.day.averageW).toBeCloseTo(expected / 24, 6);
      }),
      { numRuns: 150, seed: 18 },
    );
  });
});

describe('the command-line solver prints the day of the profile', () => {
  it('a "Load profile" section before the backup study, and `profileDay` in --json', async () => {
    const { runParsed } = await import('../../core/cli/run.ts');
    const { parseArgs } = await import('../../core/cli/args.ts');
    const text = runParsed('hut.json', hillside, parseArgs(['hut.json']) as never, undefined);
    const json = runParsed('hut.json', hillside, parseArgs(['hut.json', '--json']) as never, undefined);
    if (!text.ok || !json.ok) throw new Error('the CLI refused the demo');
    // The hillside day by hand (E = Σ P·Δt): fridge 150 W × 24 h × 12/30 = 1440 Wh; lights 80 W × 12 h
    // + 220 W × 5 h + 40 W × 7 h = 2340 Wh; radios 85 W × 24 h = 2040 Wh: 5820 Wh, 242.5 W average,
    // peak 150 + 220 + 85 = 455 W (18:00–23:00, the fridge on).
    expect(text.text).toContain('Load profile\n  First day of the outage, from 18:00');
    expect(text.text).toContain('5.82 kWh, average 242.5 W, peak 455.0 W');
    expect(text.text.indexOf('Load profile')).toBeLessThan(text.text.indexOf('Battery backup'));
    expect(JSON.parse(json.text).profileDay.energyWh).toBeCloseTo(5820, 9);
  });
});
