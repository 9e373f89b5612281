/**
 * The load timeline as a runtime spread meets it (core/solve/load-profile.ts): its cuts and the
 * grouping of intervals into load states are kept per timing of the profile, the levels are read per
 * call. A sample that scales the loads gets the same intervals with scaled levels; another timing
 * gets its own intervals; every figure is the one the settings give, checked by hand.
 */
import { describe, expect, it } from 'vitest';
import { buildTimeline } from '../../../core/solve/load-profile.ts';
import type { BackupStudy, Project } from '../../../core/model/project.ts';
import hillside from '../../../core/demos/hillside-relay-hut.json' with { type: 'json' };

const project = hillside as unknown as Project;
const study = project.backup!;
const level = (p: Project, s: BackupStudy, id: string, hours: number) => {
  const tl = buildTimeline(p, s);
  const iv = tl.intervals.find((x) => x.start <= hours * 3600 && hours * 3600 < x.end)!;
  return tl.states[iv.state]![tl.loads.findIndex((l) => l.id === id)]!;
};
/** The demo with every load's power and the profile's levels scaled by f (as a spread sample's load draw). */
const scaled = (f: number): [Project, BackupStudy] => [
  { ...project, elements: project.elements.map((e) => ('power' in e && (e.kind === 'ac-load' || e.kind === 'dc-load') ? { ...e, power: e.power * f } : e)) },
  {
    ...study,
    profile: { ...study.profile, segments: (study.profile as { segments: { startHour: number; loads: Record<string, number> }[] }).segments.map((s) => ({ ...s, loads: Object.fromEntries(Object.entries(s.loads).map(([k, v]) => [k, v * f])) })) },
  } as BackupStudy,
];

describe('the timeline kept per timing of the profile', () => {
  it('the hillside demo: lights by the clock from 18:00, the fridge 12 min on in every 30 (by hand from the demo settings)', () => {
    // Outage starts at 18:00 (startHour 18): evening 220 W until 23:00, night 40 W until 06:00, day 80 W.
    expect(level(project, study, 'lights', 1)).toBe(220); // 19:00 — by hand from the demo settings
    expect(level(project, study, 'lights', 6)).toBe(40); // 00:00
    expect(level(project, study, 'lights', 14)).toBe(80); // 08:00
    // Fridge: on during [0, 12) min of every 30-minute period, at its rating 150 W, off for the rest.
    expect(level(project, study, 'fridge', 0.1)).toBe(150); // 6 min — by hand
    expect(level(project, study, 'fridge', 0.25)).toBe(0); // 15 min
    expect(level(project, study, 'fridge', 0.55)).toBe(150); // 33 min
  });

  it('a sample that scales the loads keeps the intervals and scales the levels', () => {
    const base = buildTimeline(project, study);
    const [p, s] = scaled(1.1);
    const tl = buildTimeline(p, s);
    expect(tl.intervals).toEqual(base.intervals);
    expect(tl.end).toBe(base.end);
    // 220 W × 1.1 and 150 W × 1.1 (by hand)
    expect(level(p, s, 'lights', 1)).toBeCloseTo(242, 9);
    expect(level(p, s, 'fridge', 0.1)).toBeCloseTo(165, 9);
    // Back to the project as given: its own levels again, not the scaled sample's.
    expect(level(project, study, 'lights', 1)).toBe(220);
  });

  it('another timing gets its own intervals (horizon, duty period, start hour)', () => {
    const base = buildTimeline(project, study);
    // 96 h horizon (the demo) against 24 h: the timeline ends at 24 h.
    expect(base.end).toBe(96 * 3600);
    expect(buildTimeline(project, { ...study, horizonHours: 24 }).end).toBe(24 * 3600);
    const p = study.profile as Extract<BackupStudy['profile'], { kind: 'daily' }>;
    // The fridge on a 60-minute period: at 33 min it is off (12 min on), at 65 min on again.
    const hourly = { ...study, profile: { ...p, duty: [{ load: 'fridge', periodMinutes: 60, onMinutes: 12 }] } } as BackupStudy;
    expect(level(project, hourly, 'fridge', 0.55)).toBe(0); // 33 min — by hand
    expect(level(project, hourly, 'fridge', 65 / 60)).toBe(150); // 65 min
    // Starting at 06:00 the first hours are the day segment (80 W).
    const morning = { ...study, profile: { ...p, startHour: 6 } } as BackupStudy;
    expect(level(project, morning, 'lights', 1)).toBe(80); // 07:00 — by hand
    // And the demo's own timing is still what it was.
    expect(buildTimeline(project, study).intervals).toEqual(base.intervals);
    expect(level(project, study, 'fridge', 0.55)).toBe(150);
  });

  it('the shared intervals are read only', () => {
    const tl = buildTimeline(project, study);
    expect(() => {
      tl.intervals[0]!.end = 1;
    }).toThrow(TypeError);
    expect(buildTimeline(project, study).intervals[0]!.end).not.toBe(1);
  });
});
