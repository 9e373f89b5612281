/** A polite notice when a new version of the app is installed and waiting; the user picks the moment. */
import { useState } from 'preact/hooks';
import { activateUpdate, updateWaiting } from '../sw-register.ts';

export function UpdatePrompt() {
  const [busy, setBusy] = useState(false);
  if (!updateWaiting.value) return null;
  return (
    <section class="update-prompt" role="status" aria-live="polite" data-testid="update-prompt">
      <p>A new version is ready — reload when you are ready. Your projects are kept.</p>
      <button
        type="button"
        class="store-btn store-btn--primary"
        disabled={busy}
        onClick={() => {
          setBusy(true);
          void activateUpdate();
        }}
      >
        {busy ? 'Reloading…' : 'Reload now'}
      </button>
    </section>
  );
}
