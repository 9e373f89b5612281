/**
 * Reading the address hash (#demo=<id>, #project=<id>) without trusting it: a damaged %-escape (a link
 * cut short, "#project=%E0%A4%A") makes decodeURIComponent throw, which must never stop the page from
 * opening. Pure (no DOM), so the Node tests check it; app.ts acts on it.
 */
import { demoProjects } from '../../core/page.ts';

export const DEMO_HASH_PREFIX = '#demo=';
/** A read-only share link's fragment (web/state/share.ts): the project itself, compressed. */
export const SHARE_HASH_PREFIX = '#share=';

/** Does the address carry a shared project (read by web/state/share-open.ts, loaded only then)? */
export const isShareHash = (hash: string): boolean => hash.startsWith(SHARE_HASH_PREFIX);

/** decodeURIComponent that never throws: undefined for a malformed escape ("%E0%A4%A", "%"). */
export function decodeHashValue(text: string): string | undefined {
  try {
    return decodeURIComponent(text);
  } catch {
    return undefined;
  }
}

/** The demo named by the address (#demo=<id>), or undefined (also for an address that cannot be decoded). */
export function demoIdFromHash(hash: string): string | undefined {
  const fromHash = hash.startsWith(DEMO_HASH_PREFIX) ? (decodeHashValue(hash.slice(DEMO_HASH_PREFIX.length)) ?? '') : '';
  return demoProjects.some((d) => d.id === fromHash) ? fromHash : undefined;
}

export function hashForDemo(id: string): string {
  return `${DEMO_HASH_PREFIX}${encodeURIComponent(id)}`;
}

/**
 * What to tell the user when the address names a demo or a project in a form that cannot be read (a
 * broken %-escape): the app then opens as without an address. Null otherwise.
 */
export function addressProblem(hash: string): string | null {
  const named = /^#(demo|project)=(.*)$/s.exec(hash);
  if (!named || decodeHashValue(named[2]!) !== undefined) return null;
  return `The address names a ${named[1] === 'demo' ? 'demo' : 'stored project'} this app cannot read (the link may be cut short or damaged), so it opened without it.`;
}
