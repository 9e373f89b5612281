/**
 * The app does not run inside another site's page (clickjacking: a hostile page could lay its own
 * buttons over ours, or drive the project list). The host should send `frame-ancestors 'none'` and
 * `X-Frame-Options: DENY` (web/public/_headers, README "Hosting headers"); a `<meta>` policy cannot
 * say frame-ancestors, so this check is the page's own, for hosts that send no headers. It runs from
 * main.tsx, an external module (the page's policy allows no inline script).
 */

/** The parts of `window` the check reads (tests pass stand-ins). */
export interface FrameView {
  self: unknown;
  top: { location: { origin: string } } | null;
  location: { origin: string };
}

/**
 * True when the page is shown inside a frame of another origin. A cross-origin parent's location
 * cannot be read (it throws), which is itself the answer; a frame with no readable top is treated
 * the same way.
 */
export function framedByAnotherOrigin(view: FrameView): boolean {
  if (view.top === view.self) return false;
  try {
    return view.top === null || view.top.location.origin !== view.location.origin;
  } catch {
    return true;
  }
}

/** Instead of the app: a sentence and a link that opens it in a tab of its own. */
export function showFramedNotice(root: HTMLElement, href: string): void {
  const box = document.createElement('main');
  box.className = 'framed-notice';
  box.setAttribute('data-testid', 'framed-notice');
  const p = document.createElement('p');
  p.textContent = 'Joulepath does not run inside another site’s page, so that no other page can act on your projects. ';
  const a = document.createElement('a');
  a.href = href;
  a.target = '_blank';
  a.rel = 'noopener noreferrer';
  a.textContent = 'Open Joulepath in its own tab';
  p.append(a);
  box.append(p);
  root.replaceChildren(box);
}
