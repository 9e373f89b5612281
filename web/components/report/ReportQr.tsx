/**
 * The share link as a QR code on the printed report (first page), when the link is short enough to
 * scan from paper (web/state/share.ts SHARE_QR_MAX_CHARS). The link and the QR library (uqr) load
 * only when the report is drawn, never with the first screen.
 */
import { useEffect, useState } from 'preact/hooks';
import type { DraftProject } from '../../state/draft.ts';

/** The address a share fragment opens, on this page's own origin and path. */
export function shareUrl(hash: string): string {
  return `${location.origin}${location.pathname}${hash}`;
}

interface Drawn {
  url: string;
  size: number;
  path: string;
}

/** One square per dark module ("M x y h1 v1 h-1 z"), in module units. */
function modulesPath(data: readonly (readonly boolean[])[]): string {
  let d = '';
  data.forEach((row, y) => row.forEach((dark, x) => {
    if (dark) d += `M${x} ${y}h1v1h-1z`;
  }));
  return d;
}

/**
 * How long the project must stay unchanged before its code is drawn again, ms. Compressing the
 * project and encoding the QR symbol take about 13 ms of a laptop's time (measured with a CPU profile
 * on the cold-store demo), and the report is hidden on screen: while the user types, none of that runs.
 */
export const QR_SETTLE_MS = 800;

export function ReportQr({ project }: { project: DraftProject }) {
  const [drawn, setDrawn] = useState<(Drawn & { of: DraftProject }) | null>(null);
  useEffect(() => {
    let live = true;
    const timer = setTimeout(() => void (async () => {
      const [{ shareHash, SHARE_QR_MAX_CHARS }, { encode }] = await Promise.all([import('../../state/share.ts'), import('uqr')]);
      const made = await shareHash(project);
      if (!live) return;
      const url = made.ok ? shareUrl(made.hash) : '';
      if (!made.ok || url.length > SHARE_QR_MAX_CHARS) {
        setDrawn(null);
        return;
      }
      // Error correction L: the most data per module; paper in a folder is not a damaged sticker (ISO/IEC 18004, 4.15).
      const qr = encode(url, { ecc: 'L', border: 0 });
      setDrawn({ url, size: qr.size, path: modulesPath(qr.data), of: project });
    })(), QR_SETTLE_MS);
    return () => {
      live = false;
      clearTimeout(timer);
    };
  }, [project]);
  // A code drawn for an earlier version of the project is never printed: it would open that version.
  if (!drawn || drawn.of !== project) return null;
  // A quiet zone of four modules on every side (ISO/IEC 18004:2015, 5.3.8).
  const q = 4;
  return (
    <figure class="report__qr" data-testid="report-qr" data-link={drawn.url} data-size={drawn.size}>
      <svg viewBox={`${-q} ${-q} ${drawn.size + 2 * q} ${drawn.size + 2 * q}`} role="img" aria-label="QR code of the read-only link to this design" shape-rendering="crispEdges">
        <rect x={-q} y={-q} width={drawn.size + 2 * q} height={drawn.size + 2 * q} fill="#ffffff" />
        <path d={drawn.path} fill="#000000" />
      </svg>
      <figcaption>Scan to open this design, read-only, on a phone. The link holds the design itself: nothing is sent to a server.</figcaption>
    </figure>
  );
}
