/**
 * The client report's answers (web/components/answers/ReportAnswers.tsx) as text, rendered in Node by
 * walking the component's element tree: the figures are core's (runtime, bank, cable size with device
 * and drop, start verdicts, yearly cost) and no calculation words reach the client's page.
 * The component is imported by URL: the root type check has no DOM library (as storage-session.test.ts).
 */
import { describe, expect, it } from 'vitest';
import { demoProjects } from '../../core/demos/index.ts';
import { solveAnswers } from '../../core/solve/answers.ts';
import { answerStudies } from '../../core/studies/answers.ts';
import { formatCurrent, formatDuration } from '../../web/format/number.ts';
import { solvedOf } from '../core/solved.ts';

type VNode = { type: unknown; props: Record<string, unknown> } | string | number | boolean | null | undefined | VNode[];

/** The text a tree of Preact elements renders to (function components called with their props). */
function textOf(node: VNode): string {
  if (node === null || node === undefined || typeof node === 'boolean') return '';
  if (typeof node === 'string' || typeof node === 'number') return String(node);
  if (Array.isArray(node)) return node.map(textOf).join('');
  if (typeof node.type === 'function') return textOf((node.type as (p: unknown) => VNode)(node.props));
  const own = textOf(node.props['children'] as VNode);
  return ['li', 'p', 'tr', 'caption', 'h3'].includes(String(node.type)) ? ` ${own} ` : typeof node.type === 'string' && ['td', 'th'].includes(node.type) ? ` ${own} |` : own;
}

const { ReportAnswers } = (await import(/* @vite-ignore */ new URL('../../web/components/answers/ReportAnswers.tsx', import.meta.url).href)) as {
  ReportAnswers: (p: Record<string, unknown>) => VNode;
};

const plain = (s: string) => s.replace(/[\s\u202f\u00a0]+/g, ' ').trim();

describe('the client report’s answers', () => {
  for (const d of demoProjects) {
    const solved = solvedOf(d.project);
    const answers = solveAnswers(solved);
    const studies = answerStudies(solved, { pricePerKWh: 0.3, hoursPerYear: 8760 });
    const text = plain(textOf(ReportAnswers({ solved, answers, studies, locale: 'en-US' })));
    if (process.env['JP_SHOW']) console.log(text);

    it(`${d.id}: carries the runtime and bank, cable sizes with device and drop, currents, start verdicts and the yearly cost`, () => {
      for (const b of studies.banks) {
        expect(text).toContain(plain(formatDuration(b.runtimeSeconds, 'en-US')));
        expect(text).toContain(b.sizedBank!);
        expect(text).toContain(plain(formatCurrent(b.cableCurrent.amps, 'en-US')));
      }
      for (const c of answers.cables) {
        expect(text).toContain(c.size);
        expect(text).toContain(plain(formatCurrent(c.deviceRating!, 'en-US')));
      }
      for (const s of studies.starts) expect(text).toMatch(new RegExp(`${s.name}”: ${s.verdict === 'starts' ? 'starts' : '(its start is marginal|will not start)'}`));
      expect(text).toMatch(/a year at 0\.3 per kWh they cost about/);
    });

    it(`${d.id}: uses no calculation words`, () => {
      // The words the brief keeps off the client's pages (common practice, no source).
      expect(text).not.toMatch(/\b(solve|solved|solver|port|ports|node|nodes|sweep|sweeps)\b/i);
      expect(text).not.toMatch(/\d\.\d{7,}/); // no unformatted float
    });
  }

  it('says "being calculated" until the study answers of this pair arrive', () => {
    const solved = solvedOf(demoProjects.find((x) => x.id === 'hillside-relay-hut')!.project);
    const text = plain(textOf(ReportAnswers({ solved, studies: null, locale: 'en-US' })));
    expect(text).toMatch(/runtime to the end of discharge being calculated/);
  });
});
