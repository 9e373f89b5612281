/**
 * Shown above a project opened from a read-only share link (web/state/share-open.ts): says it is
 * read-only and that nothing is saved, and offers to keep a copy in this browser's projects.
 */
import { useState } from 'preact/hooks';
import { saveSharedCopy } from '../../state/share-open.ts';

export function SharedBanner() {
  const [message, setMessage] = useState('');
  const [busy, setBusy] = useState(false);
  const save = async () => {
    setBusy(true);
    const out = await saveSharedCopy();
    setBusy(false);
    setMessage(out.ok ? '' : out.message);
  };
  return (
    <section class="notice shared-banner" aria-label="Shared project" data-testid="shared-banner">
      <p>
        <strong>Read-only:</strong> this project was opened from a share link. You can read its results and print its report; nothing is
        changed or saved in this browser.
      </p>
      <div class="shared-banner__actions">
        <button type="button" class="report-bar__button" onClick={() => void save()} disabled={busy} data-testid="save-shared-copy">
          Save a copy to my projects
        </button>
        {message && (
          <span role="alert" data-testid="save-shared-error">
            {message}
          </span>
        )}
      </div>
    </section>
  );
}
