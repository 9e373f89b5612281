/**
 * Project files: export of the open project (a download, nothing leaves the device) and import of a
 * checked file (file-format.ts, loaded on first use) as a new or replacing stored project.
 */
import { draft, draftOrigin, loadProject } from '../state/editor.ts';
import { recordName, type StoredProject } from './record.ts';
import { type ImportChoice, importQuestion, NO_STORAGE, openRecord, refreshList, saveStatus, storageNotice, store, storedIdOf, tabId } from './session-state.ts';
import { flush } from './write-queue.ts';
import { announce } from './tabs.ts';

// The file checks and their schemas load on the first import or export (outside the first-load budget).
const fileFormat = () => import('./file-format.ts');
/** The open project as an export file (text and a file name), or null when nothing is open. */
export async function exportOpenProject(appVersion: string): Promise<{ fileName: string; text: string } | null> {
  const project = draft.peek();
  const origin = draftOrigin.peek();
  if (!project || !origin) return null;
  const { buildExport, exportFileName, exportText } = await fileFormat();
  const id = storedIdOf(origin);
  const envelope = buildExport(project, { exportedAt: new Date(), appVersion, ...(id !== undefined ? { projectId: id } : {}) });
  return { fileName: exportFileName(project.name), text: exportText(envelope) };
}

/** Offer the export as a download (a blob URL, same origin: nothing leaves the device). */
export async function downloadExport(appVersion: string): Promise<boolean> {
  const file = await exportOpenProject(appVersion);
  if (!file) return false;
  const url = URL.createObjectURL(new Blob([file.text], { type: 'application/json' }));
  const a = document.createElement('a');
  a.href = url;
  a.download = file.fileName;
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
  storageNotice.value = `Exported “${file.fileName}”. Keep it somewhere safe: it is your backup.`;
  return true;
}

function ask(fileName: string, existing: StoredProject): Promise<ImportChoice> {
  return new Promise((resolve) => {
    importQuestion.value = {
      fileName,
      existingName: recordName(existing),
      existingSavedAt: existing.savedAt,
      answer: (choice) => {
        importQuestion.value = null;
        resolve(choice);
      },
    };
  });
}

export type ImportResult = { ok: true; name: string } | { ok: false; message: string; cancelled?: boolean };

/**
 * Import a project file: checked (file-format.ts), then stored as a new project and opened. A file
 * whose project id is already stored asks first: keep both (default) or replace. Nothing stored
 * changes for a refused file.
 */
export async function importFile(file: File): Promise<ImportResult> {
  const { checkSize, parseImportBytes } = await fileFormat();
  const tooLarge = checkSize(file.size);
  if (tooLarge) return { ok: false, message: tooLarge };
  const checked = parseImportBytes(new Uint8Array(await file.arrayBuffer()));
  if (!checked.ok) return checked;
  const s = store();
  await flush();
  let replaceId: string | undefined;
  let reuseId: string | undefined;
  if (s && checked.projectId !== undefined) {
    const existing = await s.get(checked.projectId);
    if (existing?.ok && !existing.record.deletedAt) {
      const choice = await ask(file.name, existing.record);
      if (choice === 'cancel') return { ok: false, message: 'Import cancelled: nothing was changed.', cancelled: true };
      if (choice === 'replace') replaceId = checked.projectId;
    } else if (!existing) {
      reuseId = checked.projectId;
    }
  }
  const project = checked.project;
  if (!s) {
    loadProject(project, { kind: 'file', title: file.name, fileName: file.name });
    saveStatus.value = { state: 'failed', message: NO_STORAGE };
    return { ok: true, name: project.name };
  }
  const out =
    replaceId !== undefined
      ? await s.save(replaceId, project, tabId, null)
      : await s.create(project, tabId, reuseId !== undefined ? { id: reuseId } : {});
  if (!out.ok) {
    // Not stored: open it anyway so nothing is lost; the next edit tries to store it again.
    loadProject(project, { kind: 'file', title: file.name, fileName: file.name });
    saveStatus.value = { state: 'failed', message: out.reason === 'write-failed' || out.reason === 'not-writable' ? out.message : 'changed in another tab' };
    return { ok: true, name: project.name };
  }
  openRecord(out.record, true);
  announce({ type: 'saved', id: out.record.id, revision: out.record.revision, tabId });
  await refreshList();
  storageNotice.value = replaceId !== undefined ? `Replaced “${recordName(out.record)}” with the imported file.` : `Imported “${recordName(out.record)}”.`;
  return { ok: true, name: recordName(out.record) };
}
