/**
 * The profile editor's pure part (web/components/battery/profile/model.ts): the day a profile is seen
 * as, segments added and removed, handles kept in order, levels by mode, the starting points (each a
 * profile the engine accepts) and hours of the day as typed. No outside source: the checks compare the
 * editor's edits with the file format's rules and with hand-counted hours.
 */
import { describe, expect, it } from 'vitest';
import { demoProjects } from '../../core/index.ts';
import { validateProject } from '../../core/solve/validate.ts';
import { backupSettingsProblems } from '../../core/studies/backup/profile-day.ts';
import type { LoadProfile, Project } from '../../core/model/project.ts';
import {
  addDuty,
  addSegment,
  alwaysOn,
  asDaily,
  clockText,
  compressorCycling,
  eveningAndNight,
  handleRange,
  levelMode,
  levelOfMode,
  readClock,
  removeSegment,
  snapHour,
  withLevel,
} from '../../web/components/battery/profile/model.ts';

const hut = demoProjects.find((d) => d.id === 'hillside-relay-hut')!.project as Project;
const withProfile = (profile: LoadProfile): Project => ({ ...hut, backup: { ...hut.backup!, profile } });
const accepted = (profile: LoadProfile) => {
  const p = withProfile(profile);
  return validateProject(p).ok && backupSettingsProblems(p, p.backup).length === 0;
};

describe('the profile as a day', () => {
  it('a constant profile is one segment from midnight, its duty cycles kept; a run of periods has no day', () => {
    expect(asDaily({ kind: 'constant', duty: [{ load: 'fridge', periodMinutes: 30, onMinutes: 12 }] })).toEqual({
      kind: 'daily',
      startHour: 0,
      segments: [{ startHour: 0 }],
      duty: [{ load: 'fridge', periodMinutes: 30, onMinutes: 12 }],
    });
    expect(asDaily({ kind: 'segments', segments: [{ durationHours: 4 }] })).toBeNull();
  });

  it('a segment is added in the middle of the longest, on a whole hour; removing one keeps the rest', () => {
    const one = asDaily({ kind: 'constant' })!;
    const two = addSegment(one);
    expect(two.segments.map((s) => s.startHour)).toEqual([0, 12]);
    // The demo: 06–18 (12 h), 18–23 (5 h), 23–06 (7 h): the longest is split at 12:00.
    const demo = asDaily(hut.backup!.profile)!;
    expect(addSegment(demo).segments.map((s) => s.startHour)).toEqual([6, 12, 18, 23]);
    // A segment that wraps past midnight is split past it: 20:00–09:00 (13 h), its middle 02:30 taken to the whole hour 03:00.
    expect(addSegment({ kind: 'daily', segments: [{ startHour: 9 }, { startHour: 20 }] }).segments.map((s) => s.startHour)).toEqual([3, 9, 20]);
    expect(removeSegment(demo, 1).segments.map((s) => s.startHour)).toEqual([6, 23]);
    expect(removeSegment(one, 0)).toBe(one);
    expect(accepted(addSegment(demo))).toBe(true);
  });

  it('a handle moves between its neighbours, a quarter hour apart, in quarter hours', () => {
    const segs = [{ startHour: 6 }, { startHour: 18 }, { startHour: 23 }];
    expect(handleRange(segs, 0)).toEqual([0, 17.75]);
    expect(handleRange(segs, 1)).toEqual([6.25, 22.75]);
    expect(handleRange(segs, 2)).toEqual([18.25, 23.75]);
    expect(snapHour(19.13, [6.25, 22.75])).toBe(19.25);
    expect(snapHour(30, [6.25, 22.75])).toBe(22.75);
  });

  it('levels by mode: at the rating, off, a value, a share of the rating (converted both ways)', () => {
    const day = asDaily(hut.backup!.profile)!;
    expect(levelMode(day.segments[0]!.loads!['lights'])).toBe('value');
    expect(levelOfMode('percent', 110, 220)).toEqual({ percent: 50 });
    expect(levelOfMode('value', { percent: 50 }, 220)).toBe(110);
    expect(levelOfMode('percent', 500, 220)).toEqual({ percent: 100 });
    expect(levelOfMode('off', 110, 220)).toBe(false);
    expect(levelOfMode('rated', 110, 220)).toBeUndefined();
    const off = withLevel(day, 0, 'lights', undefined);
    expect(off.segments[0]).toEqual({ startHour: 6 });
    expect(accepted(withLevel(day, 1, 'lights', { percent: 50 }))).toBe(true);
  });
});

describe('starting points write profiles the engine accepts', () => {
  it('always on, evening and night, a compressor cycling', () => {
    const evening = eveningAndNight(hut.backup!.profile, 'lights');
    expect(evening.segments).toEqual([
      { startHour: 6, loads: { lights: false } },
      { startHour: 18, loads: { lights: true } },
    ]);
    const both = compressorCycling(evening, 'fridge');
    expect(both.duty).toEqual([{ load: 'fridge', periodMinutes: 30, onMinutes: 12 }]);
    expect(compressorCycling({ kind: 'constant' }, 'fridge')).toEqual({ kind: 'constant', duty: [{ load: 'fridge', periodMinutes: 30, onMinutes: 12 }] });
    expect(alwaysOn(both)).toEqual({ kind: 'daily', startHour: 18, segments: [{ startHour: 0 }] });
    for (const p of [evening, both, alwaysOn(both), addDuty(both, ['fridge', 'lights', 'radios'])]) expect(accepted(p)).toBe(true);
    expect(addDuty(both, ['fridge', 'lights']).duty!.map((d) => d.load)).toEqual(['fridge', 'lights']);
  });
});

describe('hours of the day as typed and shown', () => {
  it('reads 18:30, 18.5 and 18,5 (German number format); shows a clock', () => {
    expect(readClock('18:30', 'en')).toEqual({ ok: true, hour: 18.5 });
    expect(readClock('18.5', 'en')).toEqual({ ok: true, hour: 18.5 });
    expect(readClock('18,5', 'de')).toEqual({ ok: true, hour: 18.5 });
    expect(readClock('6:75', 'en').ok).toBe(false);
    expect(readClock('six', 'en').ok).toBe(false);
    expect(readClock('', 'en').ok).toBe(false);
    expect(clockText(6)).toBe('06:00');
    expect(clockText(23.75)).toBe('23:45');
  });
});

describe('a profile with every kind of level goes out and back in through the file', () => {
  it('export, then import: the same profile, { percent } included', async () => {
    const { buildExport, exportText, parseImportText } = await import('../../web/storage/file-format.ts');
    const profile: LoadProfile = {
      kind: 'daily',
      startHour: 18,
      segments: [
        { startHour: 6, loads: { lights: false, radios: { percent: 40 } } },
        { startHour: 18, loads: { lights: 40, radios: true } },
      ],
      duty: [{ load: 'fridge', periodMinutes: 30, onMinutes: 12, offsetMinutes: 5 }],
    };
    const project = withProfile(profile);
    const text = exportText(buildExport(project as never, { exportedAt: new Date(0), appVersion: 'test' }));
    const back = parseImportText(text);
    if (!back.ok) throw new Error(back.message);
    expect((back.project as unknown as Project).backup!.profile).toEqual(profile);
    expect(accepted(profile)).toBe(true);
  });
});
