/**
 * Projects stored in this browser: open, rename, duplicate, delete (with undo), newest save first;
 * export of the open project. Sits beside the demo picker, in the projects view (web/state/view.ts).
 */
import { useState } from 'preact/hooks';
import { chooseDemo, openStoredProject } from '../state/app.ts';
import { draftOrigin } from '../state/editor.ts';
import { effectiveLocale } from '../state/prefs.ts';
import { demoProjects } from '../../core/page.ts';
import { recordName } from '../storage/record.ts';
import { deleteStored, downloadExport, duplicateStored, hashForStored, listLoaded, projectList, renameStored } from '../storage/session.ts';
import { appVersion } from '../sw-register.ts';
import { showProject } from '../state/view.ts';

const savedAtFormats = new Map<string, Intl.DateTimeFormat>();

/** A saved time in the display locale ("3 Dec 2025, 14:05"). */
export function formatSavedAt(iso: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return 'unknown time';
  const locale = effectiveLocale();
  // Building a DateTimeFormat costs far more than using one; the save line formats after every save.
  let f = savedAtFormats.get(locale ?? '');
  if (!f) {
    f = new Intl.DateTimeFormat(locale, { dateStyle: 'medium', timeStyle: 'short' });
    savedAtFormats.set(locale ?? '', f);
  }
  return f.format(d);
}

function RenameForm({ id, name, onDone }: { id: string; name: string; onDone: () => void }) {
  const [value, setValue] = useState(name);
  const inputId = `rename-${id}`;
  return (
    <form
      class="stored__rename"
      onSubmit={(event) => {
        event.preventDefault();
        void renameStored(id, value).then(onDone);
      }}
    >
      <label for={inputId}>New name for “{name}”</label>
      <input
        id={inputId}
        type="text"
        value={value}
        maxLength={200}
        required
        // The field was opened by the user's tap on Rename: take the focus there.
        ref={(el) => el?.focus()}
        onInput={(event) => setValue(event.currentTarget.value)}
        onKeyDown={(event) => {
          if (event.key === 'Escape') onDone();
        }}
      />
      <div class="stored__actions">
        <button type="submit" class="store-btn">Save name</button>
        <button type="button" class="store-btn" onClick={onDone}>Cancel</button>
      </div>
    </form>
  );
}

export function ProjectList() {
  const [renaming, setRenaming] = useState<string | null>(null);
  const openId = draftOrigin.value?.kind === 'stored' ? draftOrigin.value.storedKey : undefined;
  const list = projectList.value;
  return (
    <section class="stored" aria-labelledby="stored-heading" data-testid="project-list">
      <h2 id="stored-heading" class="picker__heading">Your projects</h2>
      {listLoaded.value && list.length === 0 && (
        <p class="stored__empty">
          None stored yet. Change a demo or import a file: your work is saved in this browser as you go.
        </p>
      )}
      {list.length > 0 && (
        <ul class="picker__list">
          {list.map((entry) => {
            if (!entry.ok) {
              return (
                <li key={entry.id} class="stored__unreadable" data-project-id={entry.id}>
                  {entry.message}
                </li>
              );
            }
            const r = entry.record;
            const name = recordName(r);
            const current = r.id === openId;
            return (
              <li key={r.id} data-project-id={r.id}>
                <a
                  class="picker__item"
                  href={hashForStored(r.id)}
                  aria-current={current ? 'page' : undefined}
                  onClick={(event) => {
                    event.preventDefault();
                    void openStoredProject(r.id);
                    showProject();
                  }}
                >
                  <span class="picker__title">{name}</span>
                  <span class="stored__when">
                    Saved <time dateTime={r.savedAt}>{formatSavedAt(r.savedAt)}</time>
                  </span>
                </a>
                {renaming === r.id ? (
                  <RenameForm id={r.id} name={name} onDone={() => setRenaming(null)} />
                ) : (
                  <div class="stored__actions">
                    <button type="button" class="store-btn" aria-label={`Rename “${name}”`} onClick={() => setRenaming(r.id)}>
                      Rename
                    </button>
                    <button type="button" class="store-btn" aria-label={`Duplicate “${name}”`} onClick={() => void duplicateStored(r.id)}>
                      Duplicate
                    </button>
                    <button
                      type="button"
                      class="store-btn"
                      aria-label={`Delete “${name}”`}
                      onClick={() =>
                        void deleteStored(r.id).then((wasOpen) => {
                          if (wasOpen && demoProjects[0]) chooseDemo(demoProjects[0].id);
                        })
                      }
                    >
                      Delete
                    </button>
                  </div>
                )}
              </li>
            );
          })}
        </ul>
      )}
      <div class="stored__files">
        <button type="button" class="store-btn store-btn--wide" data-testid="export-project" onClick={() => void downloadExport(appVersion)}>
          Export the open project to a file
        </button>
        <p class="stored__backup">
          Exported files are your backup. Projects kept in this browser are lost if its site data is cleared or the
          device is lost.
        </p>
      </div>
    </section>
  );
}
