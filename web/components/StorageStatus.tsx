/**
 * What storage is doing, said plainly: saved or NOT saved, a project changed in another tab, an import
 * that would meet a stored project of the same id, a delete that can be undone, and (in the details)
 * whether the browser keeps the data for good and how much room it uses.
 */
import { formatSavedAt } from './ProjectList.tsx';
import { demoProjects } from '../../core/page.ts';
import { chooseDemo } from '../state/app.ts';
import {
  checkPersistence,
  conflicts,
  importQuestion,
  lastWriteMs,
  pendingDelete,
  persistence,
  resolveConflict,
  saveStatus,
  storageNotice,
  undoDelete,
  type StorageConflict,
} from '../storage/session.ts';
import { draftOrigin } from '../state/editor.ts';
import { effectiveLocale } from '../state/prefs.ts';
import { appVersion, offlineReady } from '../sw-register.ts';
import { UpdatePrompt } from './UpdatePrompt.tsx';

export function formatBytes(bytes: number): string {
  const units = ['bytes', 'kB', 'MB', 'GB', 'TB'];
  let value = bytes;
  let i = 0;
  while (value >= 1000 && i < units.length - 1) {
    value /= 1000;
    i++;
  }
  return `${new Intl.NumberFormat(effectiveLocale(), { maximumFractionDigits: i === 0 ? 0 : 1 }).format(value)} ${units[i]}`;
}

/** One line under the project list: saved, saving, or what a demo does on its first change. */
export function SaveLine() {
  const s = saveStatus.value;
  const kind = draftOrigin.value?.kind;
  let text = '';
  if (s.state === 'saved') text = `Saved in this browser at ${formatSavedAt(s.savedAt)}.`;
  else if (s.state === 'pending') text = 'Saving…';
  else if (s.state === 'idle' && kind === 'demo') text = 'Demos stay unchanged: your first change saves a copy in this browser.';
  else if (s.state === 'idle' && kind === 'new') text = 'Your first change stores this project in this browser.';
  return (
    <div class="save-line">
      <p role="status" aria-live="polite" data-testid="save-line" data-state={s.state} data-write-ms={lastWriteMs.value ?? ''}>
        {text}
      </p>
      <p role="status" aria-live="polite" data-testid="storage-notice">
        {storageNotice.value}
      </p>
    </div>
  );
}

/** Storage details: persistence, room used, offline readiness, version. */
export function StorageDetails() {
  const p = persistence.value;
  const ready = offlineReady.value;
  return (
    <details class="storage-details" data-testid="storage-details">
      <summary>Storage and offline use</summary>
      <ul>
        <li data-testid="persistence">
          {!p.supported
            ? 'This browser does not say how it keeps site data.'
            : p.persisted
              ? 'The browser keeps your projects until you delete them (persistent storage granted).'
              : 'The browser may clear your projects when the device runs short of space (persistent storage not granted). Export files as backups.'}
        </li>
        {p.usage !== null && p.quota !== null && (
          <li>
            Using {formatBytes(p.usage)} of {formatBytes(p.quota)} the browser allows this site.
          </li>
        )}
        <li data-testid="offline-ready">
          {ready === 'ready'
            ? 'Works offline: the whole app is stored on this device.'
            : ready === 'installing'
              ? 'Preparing offline use…'
              : ready === 'unsupported'
                ? 'This browser cannot keep the app for offline use.'
                : ready === 'failed'
                  ? 'Offline use could not be set up; the app works while online.'
                  : 'Offline use starts with the installed app.'}
        </li>
        <li>Joulepath version {appVersion}. Nothing you enter is sent anywhere: it stays on this device.</li>
      </ul>
      {p.supported && !p.persisted && (
        <button type="button" class="store-btn" onClick={() => void checkPersistence(true)}>
          Ask the browser to keep my projects
        </button>
      )}
    </details>
  );
}

/**
 * The question about one project changed or deleted in another tab. It names the project and says
 * when it is not the open one (parked: the answer still writes only that project's own version).
 */
function ConflictQuestion({ c, open }: { c: StorageConflict; open: boolean }) {
  const name = c.mine.name || 'Untitled project';
  const textId = `conflict-text-${c.id}`;
  const answer = (choice: 'load-theirs' | 'keep-mine' | 'save-copy') =>
    void resolveConflict(choice, c.id).then((leftDeleted) => {
      if (leftDeleted && demoProjects[0]) chooseDemo(demoProjects[0].id);
    });
  const where = open ? 'This project' : `“${name}” (not the open project; your unsaved version of it is kept here)`;
  const what =
    c.kind === 'changed'
      ? `${where} was changed in another tab${c.theirs ? ` (saved ${formatSavedAt(c.theirs.savedAt)})` : ''}. Which version do you want?`
      : `${where} was deleted in another tab. Your version is still here: what should happen to it?`;
  return (
    <section class="storage-alert" role="alertdialog" aria-labelledby={textId} data-testid="conflict" data-project-id={c.id} data-kind={c.kind}>
      <p id={textId}>{what}</p>
      <div class="storage-alert__actions">
        <button type="button" class="store-btn" onClick={() => answer('load-theirs')}>
          {c.kind === 'changed' ? (open ? 'Load that version' : 'Keep that version (drop mine)') : 'Leave it deleted (drop mine)'}
        </button>
        <button type="button" class="store-btn" onClick={() => answer('keep-mine')}>
          {c.kind === 'changed' ? 'Keep mine (save over it)' : 'Restore it with my version'}
        </button>
        <button type="button" class="store-btn" onClick={() => answer('save-copy')}>
          Save mine as a copy
        </button>
      </div>
    </section>
  );
}

/** Messages that need an answer or must not be missed, fixed at the bottom of the screen. */
export function StorageAlerts() {
  const s = saveStatus.value;
  const cs = conflicts.value;
  const origin = draftOrigin.value;
  const openId = origin?.kind === 'stored' ? origin.storedKey : undefined;
  const q = importQuestion.value;
  const d = pendingDelete.value;
  return (
    <div class="storage-alerts">
      <UpdatePrompt />
      {s.state === 'failed' && (
        <section class="storage-alert storage-alert--error" role="alert" data-testid="save-failed">
          <p>
            <strong>Not saved.</strong> Your latest changes are NOT stored: {s.message}. They are still on this page —
            keep it open and export the project to a file. Joulepath tries again at your next change.
          </p>
        </section>
      )}
      {cs.map((c) => (
        <ConflictQuestion key={c.id} c={c} open={c.id === openId} />
      ))}
      {q && (
        <section class="storage-alert" role="alertdialog" aria-labelledby="import-question" data-testid="import-question">
          <p id="import-question">
            “{q.fileName}” holds a project that is already stored here: “{q.existingName}”, saved{' '}
            {formatSavedAt(q.existingSavedAt)}.
          </p>
          <div class="storage-alert__actions">
            <button type="button" class="store-btn store-btn--primary" ref={(el) => el?.focus()} onClick={() => q.answer('keep-both')}>
              Keep both
            </button>
            <button type="button" class="store-btn" onClick={() => q.answer('replace')}>
              Replace the stored one
            </button>
            <button type="button" class="store-btn" onClick={() => q.answer('cancel')}>
              Cancel
            </button>
          </div>
        </section>
      )}
      {d && (
        <section class="storage-alert" role="status" data-testid="undo-delete">
          <p>Deleted “{d.name}”.</p>
          <button type="button" class="store-btn" onClick={() => void undoDelete()}>
            Undo
          </button>
        </section>
      )}
    </div>
  );
}
