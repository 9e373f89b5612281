/**
 * "Share read-only": makes the link whose fragment carries the project (web/state/share.ts), shows
 * it to copy (and copies it when the browser allows), or says plainly why a project is too large.
 */
import { useState } from 'preact/hooks';
import type { DraftProject } from '../../state/draft.ts';
import { shareUrl } from './ReportQr.tsx';

type Shown = { kind: 'link'; url: string; copied: boolean } | { kind: 'refused'; message: string } | null;

export function ShareLink({ project }: { project: DraftProject }) {
  const [shown, setShown] = useState<Shown>(null);
  const make = async () => {
    const { shareHash } = await import('../../state/share.ts');
    const made = await shareHash(project);
    if (!made.ok) {
      setShown({ kind: 'refused', message: made.message });
      return;
    }
    const url = shareUrl(made.hash);
    let copied = false;
    try {
      await navigator.clipboard.writeText(url);
      copied = true;
    } catch {
      // Not allowed here (no permission, no secure context): the box below holds it to copy by hand.
    }
    setShown({ kind: 'link', url, copied });
  };
  return (
    <div class="share-link" data-testid="share">
      <button type="button" class="report-bar__button" onClick={() => void make()} data-testid="share-button">
        Share read-only
      </button>
      {shown?.kind === 'link' && (
        <p class="share-link__out" role="status">
          <label>
            {shown.copied ? 'Link copied. ' : ''}Read-only link (the design travels inside it; nothing is sent to a server):{' '}
            <input type="text" readOnly value={shown.url} data-testid="share-url" onFocus={(e) => e.currentTarget.select()} />
          </label>
        </p>
      )}
      {shown?.kind === 'refused' && (
        <p class="share-link__out" role="alert" data-testid="share-refused">
          {shown.message}
        </p>
      )}
    </div>
  );
}
