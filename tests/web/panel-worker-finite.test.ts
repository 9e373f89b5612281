/**
 * The panel worker refuses a study whose figures are not all finite numbers (issue 14, point 15):
 * the battery study is made to hand back one NaN, as a slip in it would, and the reply must be a
 * refusal naming the element by its name and the field, never a panel of NaN. The machines study
 * of a demo must pass through unchanged. Each request carries the solved value, as the page sends it.
 */
import { describe, expect, it, vi } from 'vitest';
import { demoProjects } from '../../core/demos/index.ts';
import { solveProject, type Solved } from '../../core/solve/index.ts';
import { solvedOf } from '../core/solved.ts';

vi.mock('../../core/studies/backup/study.ts', async (importOriginal) => {
  const real = await importOriginal<typeof import('../../core/studies/backup/study.ts')>();
  return {
    ...real,
    runBackupStudy: (solved: Solved) => {
      const o = real.runBackupStudy(solved);
      if (o.ok && solved.project.name === 'Poisoned') o.study.discharge.runtimeSeconds = Number.NaN;
      return o;
    },
  };
});

type Reply = { id: number; reply: { kind: string; outcome: { ok: boolean; problems?: { code: string; elementId: string; field: string; message: string }[] } } };
const scope = globalThis as unknown as { onmessage: ((e: { data: unknown }) => void) | null; postMessage: (m: Reply) => void };

async function ask(request: unknown): Promise<Reply['reply']> {
  const replies: Reply[] = [];
  scope.postMessage = (m) => replies.push(m);
  await import('../../web/components/panel-worker.ts');
  scope.onmessage!({ data: { id: 1, request } });
  expect(replies).toHaveLength(1);
  return replies[0]!.reply;
}

const hut = demoProjects.find((d) => d.id === 'hillside-relay-hut')!.project;

describe('panel worker: non-finite study figures are refused', () => {
  it('passes a finite battery study through', async () => {
    const reply = await ask({ kind: 'battery', solved: solvedOf(hut) });
    expect(reply.kind).toBe('battery');
    expect(reply.outcome.ok).toBe(true);
  });

  it('refuses a battery study holding NaN, naming where', async () => {
    const reply = await ask({ kind: 'battery', solved: solvedOf({ ...hut, name: 'Poisoned' }) });
    expect(reply.outcome.ok).toBe(false);
    const p = reply.outcome.problems!;
    expect(p.map((q) => q.code)).toEqual(['non-finite']);
    expect(p[0]!.message).toContain('battery backup study');
    expect(p[0]).toMatchObject({ elementId: 'bank', field: 'runtimeSeconds' });
    expect(p[0]!.message).toContain('"48 V LiFePO4 bank"');
    expect(p[0]!.message).toContain('runtime seconds (not a number)');
  });

  it('passes the machines figures of the pump demo through', async () => {
    const pump = demoProjects.find((d) => d.id === 'riverside-pump-station')!.project;
    const solved = solveProject(pump);
    if (!solved.ok) throw new Error('demo must solve');
    const reply = await ask({ kind: 'machines', solved, cost: { pricePerKWh: 0.2, hoursPerYear: 8760 } });
    expect(reply.outcome.ok).toBe(true);
  });
});
