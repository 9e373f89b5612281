/**
 * The load profile editor of the battery panel's backup study: starting points in plain words, the
 * outage's start and the study's length, the day's segments on a 24-hour strip (drag or arrow keys)
 * and as typed start hours, each load's level per segment (at its rating, off, in W / VA / A, or as a
 * share of its rating), duty cycles per load, and a preview of the loads' total over the day.
 *
 * Loads are named by their element names; every typed value is read in the user's units and number
 * format (web/format/parse.ts). An edit is checked as the study would check it before it is stored
 * (profile/write.ts): a refused value keeps its message at its field and nothing is stored from it.
 * The preview's figures are core's (profileDay); this file lays them out.
 */
import { useMemo, useState } from 'preact/hooks';
import { PROJECT_LEVEL, type DutySchedule, type LoadProfile, type LoadSetting, type Project } from '../../../core/page.ts';
import { profileDay, profileLoadList, type ProfileLoadInfo } from '../../../core/studies/index.ts';
import type { UnitSystem } from '../../format/units.ts';
import { inputText, inputUnit, readNumberField, type Quantity } from '../../format/parse.ts';
import { formatEnergy, formatPower, formatWithPrefix } from '../../format/number.ts';
import { fieldError, getAt, lastSolved, setFieldError, type DraftProject } from '../../state/editor.ts';
import { StudyInput } from '../StudyInput.tsx';
import { DayStrip } from './profile/DayStrip.tsx';
import { DayChart } from './profile/DayChart.tsx';
import {
  addDuty,
  addSegment,
  alwaysOn,
  asDaily,
  clockText,
  compressorCycling,
  eveningAndNight,
  levelMode,
  levelOfMode,
  readClock,
  removeSegment,
  segmentEnd,
  withDuty,
  withLevel,
  withStartHour,
  type DailyProfile,
  type LevelMode,
} from './profile/model.ts';
import { draftProfile, writeProfile, writeStudy } from './profile/write.ts';

type Reading<T> = { ok: true; value: T } | { ok: false; message: string };

interface EditFieldProps<T> {
  id: string;
  label: string;
  unit: string;
  /** The path the control's message is kept at (the engine's field path). */
  fieldPath: string;
  /** The stored value as text. */
  shown: string;
  read: (text: string) => Reading<T>;
  /** Store the value; a message when refused. */
  write: (value: T) => string | null;
  hint?: string | undefined;
  testId: string;
}

/** A labelled input whose typed text is read, checked and stored at once; a refusal stays at the field. */
function EditField<T>({ id, label, unit, fieldPath, shown, read, write, hint, testId }: EditFieldProps<T>) {
  const [text, setText] = useState<string | null>(null);
  return (
    <StudyInput
      id={id}
      label={label}
      unit={unit}
      text={text ?? shown}
      placeholder={hint}
      message={fieldError(PROJECT_LEVEL, fieldPath)}
      onText={(typed) => {
        setText(typed);
        const r = read(typed);
        if (!r.ok) {
          setFieldError(PROJECT_LEVEL, fieldPath, r.message);
          return;
        }
        write(r.value);
      }}
      onLeave={() => {
        if (!fieldError(PROJECT_LEVEL, fieldPath)) setText(null);
      }}
      testId={testId}
    />
  );
}

const numberReader =
  (label: string, quantity: Quantity, units: UnitSystem, locale: string | undefined, required = true) =>
  (text: string): Reading<number | undefined> => {
    const r = readNumberField(text, { label, quantity, required }, units, locale);
    return r.ok ? { ok: true, value: r.value } : { ok: false, message: r.message };
  };

const clockReader = (label: string, locale: string | undefined) => (text: string): Reading<number> => {
  const r = readClock(text, locale);
  return r.ok ? { ok: true, value: r.hour } : { ok: false, message: `${label}: ${r.message}` };
};

/** The quantity a level in a load's own unit is typed in. */
const UNIT_QUANTITY: Record<ProfileLoadInfo['unit'], Quantity> = { W: 'power', VA: 'apparent-power', A: 'current' };
const UNIT_WORD: Record<ProfileLoadInfo['unit'], string> = { W: 'power', VA: 'apparent power', A: 'current' };

/** A safe piece of a DOM id for a load: its place in the list (ids may hold any character). */
const domKey = (loads: readonly ProfileLoadInfo[], id: string) => loads.findIndex((l) => l.id === id);

interface Common {
  units: UnitSystem;
  locale: string | undefined;
  loads: readonly ProfileLoadInfo[];
}

function LevelControl({ day, seg, load, common }: { day: DailyProfile; seg: number; load: ProfileLoadInfo; common: Common }) {
  const { units, locale, loads } = common;
  const setting = day.segments[seg]!.loads?.[load.id] as LoadSetting | undefined;
  const mode = levelMode(Object.hasOwn(day.segments[seg]!.loads ?? {}, load.id) ? setting : undefined);
  const k = domKey(loads, load.id);
  const base = `profile-seg-${seg}-load-${k}`;
  const path = `backup.profile.segments.${seg}.loads.${load.id}`;
  const quantity = mode === 'percent' ? 'percent' : UNIT_QUANTITY[load.unit];
  const unit = inputUnit(quantity, units);
  const rated = formatWithPrefix(load.rated, load.unit, 4, locale);
  const label = `${load.name}: ${mode === 'percent' ? 'share of its rating' : UNIT_WORD[load.unit]}`;
  const undo = `Load profile: ${load.name} in segment ${seg + 1}`;
  const put = (level: LoadSetting | undefined) => {
    const next = withLevel(day, seg, load.id, level);
    return writeProfile(next, path, undo, { path: `backup.profile.segments.${seg}.loads`, value: next.segments[seg]!.loads });
  };
  return (
    <div class="profile-level">
      <div class="study-field">
        <label for={`${base}-mode`} class="study-field__label">
          {load.name}
        </label>
        <select
          id={`${base}-mode`}
          class="study-field__input"
          value={mode}
          onChange={(e) => {
            const next = (e.currentTarget as HTMLSelectElement).value as LevelMode;
            put(levelOfMode(next, setting, load.rated));
          }}
          data-testid={`profile-seg-${seg}-mode-${k}`}
        >
          <option value="rated">At its rating ({rated})</option>
          <option value="off">Off</option>
          <option value="value">Set {UNIT_WORD[load.unit]} ({load.unit})</option>
          <option value="percent">Share of its rating (%)</option>
        </select>
      </div>
      {(mode === 'value' || mode === 'percent') && (
        <EditField
          id={`${base}-value`}
          label={label}
          unit={unit.symbol}
          fieldPath={path}
          shown={mode === 'percent' ? inputText((setting as { percent: number }).percent, 'percent', units, locale) : inputText(setting, quantity, units, locale)}
          read={numberReader(label, quantity, units, locale)}
          write={(v) => put(mode === 'percent' ? { percent: v! } : v!)}
          testId={`profile-seg-${seg}-value-${k}`}
        />
      )}
    </div>
  );
}

/** A segment's new start hour (typed or from the strip). */
const moveStart = (day: DailyProfile, seg: number, hour: number) => {
  const path = `backup.profile.segments.${seg}.startHour`;
  return writeProfile(withStartHour(day, seg, hour), path, `Load profile: start of segment ${seg + 1}`, { path, value: hour });
};

function SegmentCard({ day, seg, common }: { day: DailyProfile; seg: number; common: Common }) {
  const s = day.segments[seg]!;
  const end = segmentEnd(day.segments, seg) % 24;
  const headingId = `profile-seg-${seg}-heading`;
  return (
    <fieldset class="profile-segment" data-testid={`profile-seg-${seg}`} aria-labelledby={headingId}>
      <legend id={headingId}>
        Segment {seg + 1}: {clockText(s.startHour)} to {clockText(end)}
      </legend>
      <div class="profile-segment__head">
        <EditField
          id={`profile-seg-${seg}-start`}
          label={`Segment ${seg + 1} starts at`}
          unit=""
          fieldPath={`backup.profile.segments.${seg}.startHour`}
          shown={clockText(s.startHour)}
          read={clockReader(`Segment ${seg + 1} starts at`, common.locale)}
          write={(hour) => moveStart(day, seg, hour)}
          hint="18:00"
          testId={`profile-seg-${seg}-start`}
        />
        {day.segments.length > 1 && (
          <button type="button" class="panel-button" onClick={() => writeProfile(removeSegment(day, seg), 'backup.profile.segments', `Load profile: removed segment ${seg + 1}`, { path: 'backup.profile.segments', value: removeSegment(day, seg).segments })} data-testid={`profile-seg-${seg}-remove`}>
            Remove segment {seg + 1}
          </button>
        )}
      </div>
      <div class="profile-segment__levels">
        {common.loads.map((load) => (
          <LevelControl key={load.id} day={day} seg={seg} load={load} common={common} />
        ))}
        {Object.keys(s.loads ?? {})
          .filter((id) => !common.loads.some((l) => l.id === id))
          .map((id) => (
            <p key={id} class="note">
              The profile sets “{id}”, which is not a load of this project.{' '}
              <button type="button" class="panel-button" onClick={() => writeProfile(withLevel(day, seg, id, undefined), `backup.profile.segments.${seg}.loads.${id}`, `Load profile: removed “${id}” from segment ${seg + 1}`)}>
                Remove it from segment {seg + 1}
              </button>
            </p>
          ))}
      </div>
    </fieldset>
  );
}

function DutyRow({ profile, k, common }: { profile: LoadProfile; k: number; common: Common }) {
  const { units, locale, loads } = common;
  const d = profile.duty![k]!;
  const path = `backup.profile.duty.${k}`;
  const name = loads.find((l) => l.id === d.load)?.name ?? d.load;
  const put = (next: Partial<DutySchedule>, field: string) => {
    const duty = profile.duty!.map((x, i) => {
      if (i !== k) return x;
      const merged = { ...x, ...next };
      if (merged.offsetMinutes === undefined) delete merged.offsetMinutes;
      return merged;
    });
    return writeProfile(withDuty(profile, duty), `${path}.${field}`, `Load profile: duty cycle of ${name}`, { path, value: duty[k] });
  };
  const minutes = (label: string, required: boolean) => numberReader(label, 'ratio', units, locale, required);
  return (
    <fieldset class="profile-duty" data-testid={`profile-duty-${k}`} aria-labelledby={`profile-duty-${k}-heading`}>
      <legend id={`profile-duty-${k}-heading`}>Duty cycle {k + 1}: {name}</legend>
      <div class="study-field">
        <label for={`profile-duty-${k}-load`} class="study-field__label">
          Load
        </label>
        <select
          id={`profile-duty-${k}-load`}
          class="study-field__input"
          value={d.load}
          onChange={(e) => put({ load: (e.currentTarget as HTMLSelectElement).value }, 'load')}
          data-testid={`profile-duty-${k}-load`}
        >
          {loads.map((l) => (
            <option key={l.id} value={l.id}>
              {l.name}
            </option>
          ))}
        </select>
      </div>
      <EditField
        id={`profile-duty-${k}-period`}
        label="Period"
        unit="min"
        fieldPath={`${path}.periodMinutes`}
        shown={inputText(d.periodMinutes, 'ratio', units, locale)}
        read={minutes('Period', true)}
        write={(v) => put({ periodMinutes: v! }, 'periodMinutes')}
        testId={`profile-duty-${k}-period`}
      />
      <EditField
        id={`profile-duty-${k}-on`}
        label="On for"
        unit="min"
        fieldPath={`${path}.onMinutes`}
        shown={inputText(d.onMinutes, 'ratio', units, locale)}
        read={minutes('On for', true)}
        write={(v) => put({ onMinutes: v! }, 'onMinutes')}
        testId={`profile-duty-${k}-on`}
      />
      <EditField
        id={`profile-duty-${k}-offset`}
        label="First on after the outage begins"
        unit="min"
        fieldPath={`${path}.offsetMinutes`}
        shown={inputText(d.offsetMinutes, 'ratio', units, locale)}
        read={minutes('First on after the outage begins', false)}
        write={(v) => put({ offsetMinutes: v }, 'offsetMinutes')}
        hint="0"
        testId={`profile-duty-${k}-offset`}
      />
      <button
        type="button"
        class="panel-button"
        onClick={() => writeProfile(withDuty(profile, profile.duty!.filter((_, i) => i !== k)), 'backup.profile.duty', `Load profile: removed the duty cycle of ${name}`)}
        data-testid={`profile-duty-${k}-remove`}
      >
        Remove duty cycle {k + 1}
      </button>
    </fieldset>
  );
}

function StartingPoints({ profile, common }: { profile: LoadProfile | undefined; common: Common }) {
  const [chosen, setChosen] = useState<string | null>(null);
  const loadId = chosen !== null && common.loads.some((l) => l.id === chosen) ? chosen : common.loads[0]?.id;
  const name = common.loads.find((l) => l.id === loadId)?.name ?? '';
  return (
    <fieldset class="profile-starts" data-testid="profile-starts">
      <legend>Start from</legend>
      <p class="note">Each writes a profile you then change below.</p>
      <div class="study-field">
        <label for="profile-start-load" class="study-field__label">
          Load for the starting points
        </label>
        <select id="profile-start-load" class="study-field__input" value={loadId} onChange={(e) => setChosen((e.currentTarget as HTMLSelectElement).value)} data-testid="profile-start-load">
          {common.loads.map((l) => (
            <option key={l.id} value={l.id}>
              {l.name}
            </option>
          ))}
        </select>
      </div>
      <ul class="profile-starts__list">
        <li>
          <button type="button" class="panel-button" onClick={() => writeProfile(alwaysOn(profile), 'backup.profile', 'Load profile: always on')} data-testid="profile-start-always">
            Always on
          </button>{' '}
          every load at its rating all day and night, no duty cycles
        </li>
        {loadId !== undefined && (
          <>
            <li>
              <button type="button" class="panel-button" onClick={() => writeProfile(eveningAndNight(profile, loadId), 'backup.profile', `Load profile: ${name} in the evening and night`)} data-testid="profile-start-evening">
                Evening and night
              </button>{' '}
              {name} on from 18:00 to 06:00, off by day (the day's segments replaced)
            </li>
            <li>
              <button type="button" class="panel-button" onClick={() => writeProfile(compressorCycling(profile, loadId), 'backup.profile', `Load profile: ${name} cycling`)} data-testid="profile-start-compressor">
                A compressor cycling
              </button>{' '}
              {name} on 12 min in every 30 min
            </li>
          </>
        )}
      </ul>
    </fieldset>
  );
}

function Preview({ project, common }: { project: DraftProject; common: Common }) {
  const { locale } = common;
  const solved = lastSolved.value;
  const backup = project.backup;
  const outcome = useMemo(() => profileDay(project as unknown as Project, backup, solved?.result), [backup, project.elements, solved]);
  if (!outcome.ok) {
    return (
      <p class="note" data-testid="profile-preview-none">
        The preview of the day follows once the profile's inputs marked above are fixed.
      </p>
    );
  }
  const { day } = outcome;
  const uncounted = day.uncounted.map((id) => common.loads.find((l) => l.id === id)?.name ?? id);
  return (
    <figure class="tchart profile-preview" data-testid="profile-preview">
      <DayChart intervals={day.intervals} locale={locale} labelledBy="profile-preview-summary" />
      <figcaption class="tchart__caption">
        <p id="profile-preview-summary" class="tchart__summary">
          Total power of the loads over the first day of the outage, by the clock (the chain's own losses come on top; the study counts them).
        </p>
        {uncounted.length > 0 && <p class="note">Not counted here until the chain solves: {uncounted.join(', ')} (given by current).</p>}
      </figcaption>
      <dl class="panel-figures">
        <div>
          <dt>Energy over the day</dt>
          <dd data-testid="profile-energy">{formatEnergy(day.energyWh, locale)}</dd>
        </div>
        <div>
          <dt>Average</dt>
          <dd data-testid="profile-average">{formatPower(day.averageW, locale)}</dd>
        </div>
        <div>
          <dt>Peak</dt>
          <dd data-testid="profile-peak">{formatPower(day.peakW, locale)}</dd>
        </div>
      </dl>
    </figure>
  );
}

/** The profile in a few words, for the line under the heading. */
function profileWords(profile: LoadProfile | undefined, loads: readonly ProfileLoadInfo[]): string {
  const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;
  const base =
    !profile || profile.kind === 'constant'
      ? 'Every load at its rating all day'
      : profile.kind === 'daily'
        ? `By the clock: ${plural(profile.segments.length, 'segment', 'segments')} a day, the outage beginning at ${clockText(profile.startHour ?? 0)}`
        : `${plural(profile.segments.length, 'period', 'periods')} from the outage's start, ${profile.repeat ? 'repeating' : 'run once'}`;
  const cycling = (profile?.duty ?? []).map((d) => loads.find((l) => l.id === d.load)?.name ?? d.load);
  return cycling.length ? `${base}; cycling on their own: ${[...new Set(cycling)].join(', ')}.` : `${base}.`;
}

export function ProfileEditor({ project, units, locale }: { project: DraftProject; units: UnitSystem; locale: string | undefined }) {
  const loads = useMemo(() => profileLoadList(project as unknown as Project), [project.elements]);
  const profile = draftProfile(project);
  const day = asDaily(profile);
  const common: Common = { units, locale, loads };
  const horizonReader = numberReader('Study length', 'time', units, locale, false);
  return (
    <section class="panel-section profile-editor" aria-labelledby="profile-heading" data-testid="profile-editor">
      <h4 id="profile-heading">Load profile</h4>
      <p class="panel-headline" data-testid="profile-words">
        {profileWords(profile, loads)}
      </p>
      <Preview project={project} common={common} />
      <details class="profile-edit" data-testid="profile-edit">
        <summary class="profile-edit__summary" data-testid="profile-edit-summary">
          Change the load profile
        </summary>
        <p class="note">How the loads run during the outage: by time of day, each load's level, and loads that switch on and off on their own.</p>
        <StartingPoints profile={profile} common={common} />
        <div class="study-settings study-settings--inline profile-times">
          {day && (
            <EditField
              id="profile-outage-start"
              label="Outage starts at"
              unit=""
              fieldPath="backup.profile.startHour"
              shown={clockText(day.startHour ?? 0)}
              read={clockReader('Outage starts at', locale)}
              write={(hour) => writeProfile({ ...day, startHour: hour }, 'backup.profile.startHour', 'Load profile: outage start', { path: 'backup.profile.startHour', value: hour })}
              hint="00:00"
              testId="profile-outage-start"
            />
          )}
          <EditField
            id="profile-horizon"
            label="Study length"
            unit={inputUnit('time', units).symbol}
            fieldPath="backup.horizonHours"
            shown={inputText(getAt(project, 'backup.horizonHours'), 'time', units, locale)}
            read={horizonReader}
            write={(v) => writeStudy('backup.horizonHours', v, 'backup.horizonHours', 'Backup study: study length')}
            hint="168"
            testId="profile-horizon"
          />
        </div>
        {day ? (
          <>
            <h5 class="profile-editor__sub">The day by the clock</h5>
            <DayStrip segments={day.segments} outageHour={day.startHour ?? 0} onMove={(i, hour) => moveStart(day, i, hour)} />
            <div class="profile-segments">
              {day.segments.map((_, i) => (
                <SegmentCard key={i} day={day} seg={i} common={common} />
              ))}
            </div>
            <button type="button" class="panel-button" onClick={() => writeProfile(addSegment(day), 'backup.profile.segments', 'Load profile: added a segment', { path: 'backup.profile.segments', value: addSegment(day).segments })} data-testid="profile-add-segment">
              Add a segment
            </button>
          </>
        ) : (
          <p class="note" data-testid="profile-periods">
            This profile runs its periods in turn from the outage's start rather than by the clock; its duty cycles are below. Choose a starting point above to edit it as a day.
          </p>
        )}
        {profile && (
          <>
            <h5 class="profile-editor__sub">Duty cycles</h5>
            <p class="note">A load that switches on and off on its own, such as a fridge's compressor: on for part of every period, counted from the outage's start.</p>
            <div class="profile-duties">
              {(profile.duty ?? []).map((_, k) => (
                <DutyRow key={k} profile={profile} k={k} common={common} />
              ))}
            </div>
            {loads.length > 0 && (
              <button type="button" class="panel-button" onClick={() => writeProfile(addDuty(profile, loads.map((l) => l.id)), 'backup.profile.duty', 'Load profile: added a duty cycle')} data-testid="profile-add-duty">
                Add a duty cycle
              </button>
            )}
          </>
        )}
      </details>
    </section>
  );
}
