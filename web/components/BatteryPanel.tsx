/**
 * The battery panel: runtime of the bank through the chain, why it is less than Wh ÷ W, the bank
 * for the target runtime, the recharge, a plot of state of charge, voltage and current, and the
 * study's common settings. Loaded on demand (App.tsx imports it when the panel is opened).
 *
 * Every figure comes from core's runBackupStudy() on the last valid solved pair (web/state/solution.ts); this file only formats. The study
 * takes several milliseconds (it solves the chain at every step of the outage), so it runs in the
 * panel worker (panel-worker.ts), off the page's thread, and only the latest draft's reply is
 * shown. When the draft does not give a study the last good figures stay, marked out of date, with
 * the engine's messages. This file asks the worker and lays the panel out; its sections are in
 * web/components/battery/: StudySettings.tsx, StudyFigures.tsx (runtime, recharge, plot), Sizing.tsx.
 */
import { useRef } from 'preact/hooks';
import type { BackupStudyResult } from '../../core/studies/index.ts';
import { PROJECT_LEVEL, type Problem } from '../../core/page.ts';
import { useWorkerReply } from './panel-client.ts';
import { effectiveLocale, unitSystem } from '../state/prefs.ts';
import { draft, edit, lastSolved, resultsState } from '../state/editor.ts';
import { problemLine } from './problem-words.ts';
import { StudyFigures } from './battery/StudyFigures.tsx';
import { StudySettings } from './battery/StudySettings.tsx';
import { ProfileEditor } from './battery/ProfileEditor.tsx';
import './Panels.css';

/** Defaults of a new backup study: every load on at its rated power, one day wanted (common practice, no source). */
export const NEW_BACKUP_STUDY = { profile: { kind: 'constant' }, targetRuntimeHours: 24, temperatureC: 25 } as const;

export function addBackupStudy(): void {
  edit('Added a backup study', (p) => {
    p.backup = structuredClone(NEW_BACKUP_STUDY) as unknown as Record<string, unknown>;
  });
}

export default function BatteryPanel() {
  const project = draft.value;
  const units = unitSystem.value;
  const locale = effectiveLocale();
  const hasStudy = project !== null && typeof project.backup === 'object' && project.backup !== null;
  // The study runs on the last valid solved pair (the worker never validates or solves it again).
  const solved = lastSolved.value;
  const { reply, pending } = useWorkerReply<'battery'>(() => (solved?.project.backup ? { kind: 'battery', solved } : null), [solved]);
  /** The last study that ran, kept while later drafts give none. */
  const last = useRef<{ study: BackupStudyResult; cautions: string[] } | null>(null);
  if (reply?.kind === 'battery' && reply.outcome.ok) last.current = { study: reply.outcome.study, cautions: reply.outcome.cautions };
  const problems: Problem[] =
    reply?.kind === 'battery' && !reply.outcome.ok
      ? reply.outcome.problems
      : reply?.kind === 'crash'
        ? [{ code: 'invalid-value', elementId: PROJECT_LEVEL, field: '', message: reply.message }]
        : [];

  if (!project) return null;
  if (!hasStudy) {
    return (
      <div class="panel-body" data-testid="battery-panel" data-state="no-study">
        <p>This project is fed by a battery bank but has no backup study yet: the study gives the runtime through the chain, the bank for a target runtime and the recharge.</p>
        <button type="button" class="panel-button panel-button--primary" onClick={addBackupStudy} data-testid="battery-add-study">
          Add a backup study
        </button>
        <p class="note">It starts with every load on at its rated power, a target of 24 h at 25 °C; change the settings after.</p>
      </div>
    );
  }

  const failed = !pending && problems.length > 0;
  const stale = failed || resultsState.value === 'stale';
  const state = pending ? 'pending' : stale ? 'stale' : 'current';
  const shown = last.current;
  const study = shown?.study ?? null;
  return (
    <div class={stale ? 'panel-body panel-body--stale' : 'panel-body'} data-testid="battery-panel" data-state={state} data-study-ms={reply ? reply.ms.toFixed(2) : ''}>
      <StudySettings project={project} units={units} locale={locale} />
      <ProfileEditor project={project} units={units} locale={locale} />
      {failed && (
        <section class="notice notice--error" role="alert" data-testid="battery-problems">
          <p>The study cannot run with these inputs{study ? '; the figures below are the last good ones, out of date' : ''}:</p>
          <ul>
            {problems.map((p, i) => (
              <li key={i}>
                {problemLine(p, project)}
              </li>
            ))}
          </ul>
        </section>
      )}
      {stale && !failed && study && (
        <p class="notice notice--stale" role="status">
          Out of date: the last good study. Fix the inputs marked above to update it.
        </p>
      )}
      {shown ? <StudyFigures study={shown.study} cautions={shown.cautions} locale={locale} units={units} /> : !failed && <p class="note">Working out the discharge…</p>}
    </div>
  );
}
