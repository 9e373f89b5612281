// The read-only share link (web/state/share.ts): every demo goes through the fragment and back
// unchanged; damaged, cut, foreign and over-long fragments are refused with a plain message.
// base64url vectors: RFC 4648 §10 test vectors (padding removed, §5 alphabet).
import { describe, expect, it } from 'vitest';
import { demoProjects } from '../../core/demos/index.ts';
import type { DraftProject } from '../../web/state/draft.ts';
import { SHARE_HASH_PREFIX, SHARE_MAX_CHARS, decodeShare, encodeShare, fromBase64Url, shareHash, toBase64Url } from '../../web/state/share.ts';

const bytes = (s: string) => new TextEncoder().encode(s);
const text = (b: Uint8Array | null) => (b ? new TextDecoder().decode(b) : null);

async function deflate(data: Uint8Array): Promise<string> {
  const out = new Response(new Blob([data as Uint8Array<ArrayBuffer>]).stream().pipeThrough(new CompressionStream('deflate')));
  return toBase64Url(new Uint8Array(await out.arrayBuffer()));
}

describe('base64url', () => {
  it.each([
    ['', ''],
    ['f', 'Zg'],
    ['fo', 'Zm8'],
    ['foo', 'Zm9v'],
    ['foob', 'Zm9vYg'],
    ['fooba', 'Zm9vYmE'],
    ['foobar', 'Zm9vYmFy'],
  ])('%j ↔ %j (RFC 4648 §10)', (plain, coded) => {
    expect(toBase64Url(bytes(plain))).toBe(coded);
    expect(text(fromBase64Url(coded))).toBe(plain);
  });
  it('uses - and _ for 62 and 63 (RFC 4648 §5), and refuses + / = and impossible lengths', () => {
    expect(toBase64Url(new Uint8Array([0xfb, 0xff]))).toBe('-_8');
    expect(fromBase64Url('+/8')).toBeNull();
    expect(fromBase64Url('Zg==')).toBeNull();
    expect(fromBase64Url('Zm9vY')).toBeNull();
    // Non-zero leftover bits in a short last group (RFC 4648 §3.5): "Zh" is not canonical for "f".
    expect(fromBase64Url('Zh')).toBeNull();
    expect(fromBase64Url('Zm8')).not.toBeNull();
    expect(fromBase64Url('Zm9')).toBeNull();
    expect(fromBase64Url('Zm-')).toBeNull();
  });
});

describe('share link', () => {
  it.each(demoProjects.map((d) => [d.id, d] as const))('%s goes through the link and back unchanged', async (_id, demo) => {
    const made = await shareHash(demo.project as unknown as DraftProject);
    expect(made.ok).toBe(true);
    if (!made.ok) return;
    expect(made.hash.startsWith(SHARE_HASH_PREFIX)).toBe(true);
    expect(made.hash).toMatch(/^#share=[A-Za-z0-9_-]+$/);
    // Compressed: shorter than the project's JSON (DEFLATE on repetitive JSON; common practice, no source).
    expect(made.hash.length).toBeLessThan(JSON.stringify(demo.project).length);
    const back = await decodeShare(made.hash);
    expect(back).toEqual({ ok: true, project: demo.project });
  });

  it('keeps the client, site and prepared-by fields', async () => {
    const project = { ...(demoProjects[0]!.project as unknown as DraftProject), client: 'Ridge Farm', site: 'Hut 3 — “north”', preparedBy: 'Ä. Volt' };
    const back = await decodeShare(`${SHARE_HASH_PREFIX}${await encodeShare(project)}`);
    expect(back).toEqual({ ok: true, project });
  });

  it('refuses a damaged, cut or foreign fragment with a plain message', async () => {
    const good = `${SHARE_HASH_PREFIX}${await encodeShare(demoProjects[0]!.project as unknown as DraftProject)}`;
    const cut = good.slice(0, Math.floor(good.length / 2));
    // One character changed: the zlib checksum (Adler-32, RFC 1950 §2.2) refuses it wherever it is
    // (the first and last 16 places, and every 7th between).
    const at = Array.from({ length: good.length - SHARE_HASH_PREFIX.length }, (_, k) => SHARE_HASH_PREFIX.length + k).filter(
      (i) => i < SHARE_HASH_PREFIX.length + 16 || i >= good.length - 16 || i % 7 === 0,
    );
    const flipped = at.map((i) => good.slice(0, i) + (good[i] === 'A' ? 'B' : 'A') + good.slice(i + 1));
    for (const hash of [cut, ...flipped, '#share=', '#share=%%%', '#share=Zg==', `${good}!`]) {
      const out = await decodeShare(hash);
      expect(out.ok, hash.slice(0, 60)).toBe(false);
      if (!out.ok) expect(out.message).toMatch(/Nothing stored in this browser was changed\.$/);
    }
  });

  it('refuses a valid zlib stream that is not a project, naming the problem', async () => {
    const notJson = await decodeShare(`${SHARE_HASH_PREFIX}${await deflate(bytes('hello'))}`);
    expect(notJson).toMatchObject({ ok: false, message: expect.stringMatching(/not a JSON project file/) });
    const notProject = await decodeShare(`${SHARE_HASH_PREFIX}${await deflate(bytes('[1,2]'))}`);
    expect(notProject).toMatchObject({ ok: false, message: expect.stringMatching(/must hold an object/) });
  });

  it('refuses a small link that unpacks past the file limit (5 MB) before reading it all', async () => {
    const bomb = await deflate(new Uint8Array(6 * 1024 * 1024).fill(32));
    expect(bomb.length).toBeLessThan(SHARE_MAX_CHARS);
    const out = await decodeShare(`${SHARE_HASH_PREFIX}${bomb}`);
    expect(out).toMatchObject({ ok: false, message: expect.stringMatching(/more than a project file may hold/) });
  });

  it('refuses to make, and to read, a link longer than the limit', async () => {
    // 2000 elements with random-looking names do not compress below the limit.
    let seed = 1;
    const rnd = () => ((seed = (seed * 48271) % 2147483647) / 2147483647).toString(36).slice(2, 12);
    const big: DraftProject = {
      format: 'joulepath-project',
      version: 2,
      name: 'Big',
      elements: [{ id: 'src', kind: 'battery', voltage: 48 }, ...Array.from({ length: 1500 }, (_, i) => ({ id: `l${i}${rnd()}`, kind: 'dc-load', from: 'src', power: 1, name: rnd() + rnd() }))],
    };
    const made = await shareHash(big);
    expect(made).toMatchObject({ ok: false, message: expect.stringMatching(/too large for a link: \d+ characters once compressed, and a link holds at most 32000\. Export the project file/) });
    const long = await decodeShare(`${SHARE_HASH_PREFIX}${'A'.repeat(SHARE_MAX_CHARS + 4)}`);
    expect(long).toMatchObject({ ok: false, message: expect.stringMatching(/longer than any this app makes/) });
  });
});
