/**
 * How the profile editor stores an edit: the changed study settings are checked first as the study
 * would check them (core's backupSettingsProblems: the file's checks and those that need the project,
 * such as start hours rising or an on-time within its period), and a problem at the edited field keeps
 * its message there and stores nothing; otherwise the value goes through the engine-checked setField
 * (web/state/editor.ts), which refuses what the file's validation refuses, as every form does.
 */
import { PROJECT_LEVEL, type LoadProfile } from '../../../../core/page.ts';
import { backupSettingsProblems } from '../../../../core/studies/index.ts';
import { draft, setAt, setField, setFieldError, type DraftProject } from '../../../state/editor.ts';
import { messageText } from '../../../format/message-text.ts';
import { effectiveLocale, unitSystem } from '../../../state/prefs.ts';
import type { Project } from '../../../../core/page.ts';

const under = (field: string, path: string) => field === path || field.startsWith(`${path}.`);

/**
 * Store `value` at `path` of the project (`backup.profile` or another `backup.<field>`), the message
 * of any refusal shown at `fieldPath` (the control's own path, e.g. `backup.profile.segments.1.startHour`).
 * Returns the message, or null when stored.
 */
export function writeStudy(path: string, value: unknown, fieldPath: string, label: string): string | null {
  const project = draft.value;
  if (!project) return 'No project is open.';
  const candidate = structuredClone((project.backup ?? {}) as Record<string, unknown>);
  setAt(candidate, path.replace(/^backup\./, ''), value);
  const problems = backupSettingsProblems(project as unknown as Project, candidate).filter((p) => p.elementId === PROJECT_LEVEL && (under(p.field, fieldPath) || under(fieldPath, p.field)));
  if (problems.length) {
    const message = problems.map((p) => messageText(p, unitSystem.value, effectiveLocale())).join('; ');
    setFieldError(PROJECT_LEVEL, fieldPath, message);
    return message;
  }
  const refused = setField(PROJECT_LEVEL, path, value, label);
  setFieldError(PROJECT_LEVEL, fieldPath, refused);
  if (refused && fieldPath !== path) setFieldError(PROJECT_LEVEL, path, null);
  return refused;
}

/**
 * Store a changed profile, the message of a refusal at `fieldPath`. With `part` (a path under
 * `backup.profile` and its value, which applied to the stored profile gives `profile`), only that part
 * is written while the stored profile is of the same kind: an undo step then covers one field's typing
 * (setField coalesces the edits of one path), not every edit of the profile in a row.
 */
export function writeProfile(profile: LoadProfile, fieldPath: string, label: string, part?: { path: string; value: unknown }): string | null {
  const stored = draft.value ? draftProfile(draft.value) : undefined;
  if (part && stored && stored.kind === profile.kind) return writeStudy(part.path, part.value, fieldPath, label);
  return writeStudy('backup.profile', profile, fieldPath, label);
}

/** The study's profile in the draft, or undefined. */
export function draftProfile(project: DraftProject): LoadProfile | undefined {
  const b = project.backup as { profile?: LoadProfile } | undefined;
  return b && typeof b === 'object' ? b.profile : undefined;
}
