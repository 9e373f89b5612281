/**
 * The read-only share link: the project, compressed, carried in the address's fragment
 * (`#share=<data>`). The fragment never leaves the browser (RFC 3986 §3.5: it is not sent with the
 * request), so opening the link sends the project to no server.
 *
 * Encoding: the project's JSON (UTF-8) → zlib (RFC 1950: DEFLATE, RFC 1951, with an Adler-32
 * checksum; the browser's CompressionStream 'deflate') → base64url without padding (RFC 4648 §5).
 * The zlib wrapper costs 6 bytes over raw DEFLATE and is kept for its checksum: a link with one
 * character changed can still inflate to a project (a changed literal), and only the checksum tells.
 * Decoding reverses it and then runs the project file import's own checks (web/storage/file-format.ts: limits, shape, ids), so a link is
 * trusted no more than a file.
 *
 * Pure apart from the streams (no DOM, no storage): the Node tests run it (Node 18+ has the streams).
 */
import { parseImportBytes } from '../storage/file-format.ts';
import { IMPORT_LIMITS } from '../storage/file-format.ts';
import type { DraftProject } from './draft.ts';

import { SHARE_HASH_PREFIX } from './address.ts';

export { SHARE_HASH_PREFIX };

/**
 * Longest fragment a share link may carry. Browsers take far longer addresses (Chromium about 2 MB),
 * but mail and chat programs, and people copying by hand, cut long ones: 32 000 characters is what
 * common practice treats as safe across current browsers (no source).
 */
export const SHARE_MAX_CHARS = 32_000;

/** Longest link printed as a QR code: a version-40 code at error correction L holds 2953 bytes (ISO/IEC 18004:2015, Table 7); past ~2 kB the modules are too small to scan from paper (common practice, no source). */
export const SHARE_QR_MAX_CHARS = 2_000;

export type ShareOutcome = { ok: true; project: DraftProject } | { ok: false; message: string };

const B64URL = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789-_';

/** base64url without padding (RFC 4648 §5). */
export function toBase64Url(bytes: Uint8Array): string {
  let out = '';
  for (let i = 0; i < bytes.length; i += 3) {
    const n = (bytes[i]! << 16) | ((bytes[i + 1] ?? 0) << 8) | (bytes[i + 2] ?? 0);
    const left = bytes.length - i;
    out += B64URL[(n >> 18) & 63]! + B64URL[(n >> 12) & 63]!;
    if (left > 1) out += B64URL[(n >> 6) & 63]!;
    if (left > 2) out += B64URL[n & 63]!;
  }
  return out;
}

/** base64url without padding back to bytes; null for any character outside the alphabet or an impossible length. */
export function fromBase64Url(text: string): Uint8Array | null {
  if (text.length % 4 === 1) return null;
  const out = new Uint8Array(Math.floor((text.length * 3) / 4));
  let o = 0;
  for (let i = 0; i < text.length; i += 4) {
    let n = 0;
    const chunk = Math.min(4, text.length - i);
    for (let j = 0; j < 4; j++) {
      const c = j < chunk ? B64URL.indexOf(text[i + j]!) : 0;
      if (c < 0) return null;
      n = (n << 6) | c;
    }
    // Canonical only (RFC 4648 §3.5): the bits a short last group leaves over must be zero, so no two links read alike.
    if ((chunk === 2 && (n & 0xffff) !== 0) || (chunk === 3 && (n & 0xff) !== 0)) return null;
    out[o++] = (n >> 16) & 255;
    if (chunk > 2) out[o++] = (n >> 8) & 255;
    if (chunk > 3) out[o++] = n & 255;
  }
  return out.subarray(0, o);
}

async function pipe(bytes: Uint8Array, stream: CompressionStream | DecompressionStream, limit = Infinity): Promise<Uint8Array | null> {
  const writer = stream.writable.getWriter();
  void writer.write(bytes as Uint8Array<ArrayBuffer>).catch(() => undefined);
  void writer.close().catch(() => undefined);
  const reader = stream.readable.getReader();
  const parts: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    // A small link that inflates past what a project file may hold is refused before it is all read.
    if (total > limit) {
      void reader.cancel().catch(() => undefined);
      return null;
    }
    parts.push(value);
  }
  const out = new Uint8Array(total);
  let at = 0;
  for (const p of parts) {
    out.set(p, at);
    at += p.byteLength;
  }
  return out;
}

/** The fragment's data for a project (without the `#share=` prefix). */
export async function encodeShare(project: DraftProject): Promise<string> {
  const json = new TextEncoder().encode(JSON.stringify(project));
  const packed = await pipe(json, new CompressionStream('deflate'));
  return toBase64Url(packed!);
}

/** The whole fragment, or the plain reason it cannot be made (too long for a link). */
export async function shareHash(project: DraftProject): Promise<{ ok: true; hash: string } | { ok: false; message: string }> {
  const data = await encodeShare(project);
  if (data.length > SHARE_MAX_CHARS) {
    return {
      ok: false,
      message: `This project is too large for a link: ${data.length} characters once compressed, and a link holds at most ${SHARE_MAX_CHARS}. Export the project file and send that instead.`,
    };
  }
  return { ok: true, hash: `${SHARE_HASH_PREFIX}${data}` };
}

const DAMAGED = 'This share link is damaged or cut short, so the project in it cannot be read. Ask for the link again. Nothing stored in this browser was changed.';

/** Read a share fragment (`#share=…`) without trusting it. */
export async function decodeShare(hash: string): Promise<ShareOutcome> {
  if (!hash.startsWith(SHARE_HASH_PREFIX)) return { ok: false, message: DAMAGED };
  const data = hash.slice(SHARE_HASH_PREFIX.length);
  if (data.length > SHARE_MAX_CHARS) {
    return { ok: false, message: `This share link is longer than any this app makes (${data.length} characters), so it was not read. Nothing stored in this browser was changed.` };
  }
  const packed = data.length > 0 ? fromBase64Url(data) : null;
  if (!packed) return { ok: false, message: DAMAGED };
  let json: Uint8Array | null;
  try {
    json = await pipe(packed, new DecompressionStream('deflate'), IMPORT_LIMITS.maxBytes);
  } catch {
    return { ok: false, message: DAMAGED };
  }
  if (!json) return { ok: false, message: `This share link unpacks to more than a project file may hold, so it was not read. Nothing stored in this browser was changed.` };
  const checked = parseImportBytes(json);
  if (!checked.ok) return { ok: false, message: `This share link does not hold a usable project: ${checked.message.replace(/ ?Nothing was imported\.$/, '')} Nothing stored in this browser was changed.` };
  return { ok: true, project: checked.project };
}

