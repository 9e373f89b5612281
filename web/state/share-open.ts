/**
 * Opening a share link (#share=…, web/state/share.ts) read-only, and keeping a copy of it.
 *
 * A shared project opens with the origin 'shared': the page shows its results and report but no
 * editor, every edit is refused (draft.ts `commit`), and the autosave writes nothing
 * (storage/write-queue.ts), so opening a link never adds to or changes what the user stored. "Save a
 * copy to my projects" stores it through the file import's own path (checked again, a new project).
 * A damaged or over-long link opens nothing and says why; the page then opens as without an address.
 */
import { draft, draftOrigin, loadProject } from './editor.ts';
import { importFile, storageNotice } from '../storage/session.ts';

/** Open the project a share fragment carries; false (with a message shown) when it cannot be read. */
export async function openShared(hash: string): Promise<boolean> {
  const { decodeShare } = await import('./share.ts');
  const out = await decodeShare(hash);
  if (!out.ok) {
    storageNotice.value = out.message;
    return false;
  }
  loadProject(out.project, { kind: 'shared', title: out.project.name || 'Shared project' });
  return true;
}

/** Store the open shared project as a new project of this browser, and open that copy. */
export async function saveSharedCopy(): Promise<{ ok: true; name: string } | { ok: false; message: string }> {
  const project = draft.peek();
  if (!project || draftOrigin.peek()?.kind !== 'shared') return { ok: false, message: 'No shared project is open.' };
  const file = new File([JSON.stringify(project)], `${project.name || 'Shared project'}.json`, { type: 'application/json' });
  const out = await importFile(file);
  return out.ok ? { ok: true, name: out.name } : { ok: false, message: out.message };
}
