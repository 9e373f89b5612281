/**
 * The final guard of the solve (core/solve/index.ts → core/solve/finite.ts) on its own: the report
 * step is made to hand back one NaN, as a slip in any kind's report would, and the solve must refuse
 * the whole result naming that element (by its name) and the field, with nothing computed shown.
 */
import { describe, expect, it, vi } from 'vitest';

// The unit project's setup (tests/web/engine.setup.ts) has already loaded the solve with the real
// report step: drop the loaded modules so this file's solve is built over the mock below.
vi.resetModules();
const { solveProject } = await import('../../core/solve/index.ts');

vi.mock('../../core/solve/report.ts', async (importOriginal) => {
  const real = await importOriginal<typeof import('../../core/solve/report.ts')>();
  return {
    ...real,
    buildResult: (...args: Parameters<typeof real.buildResult>) => {
      const built = real.buildResult(...args);
      if (built.ok && args[0] === 'Poisoned') built.result.elements[1]!.output!.current = Number.NaN;
      return built;
    },
  };
});

const chain = (name: string) => ({
  format: 'joulepath-project',
  version: 2,
  name,
  elements: [
    { id: 'src', name: 'Supply', kind: 'grid', phases: 1, voltage: 230, frequency: 50 },
    { id: 'rect', name: 'Front rectifier', kind: 'rectifier', from: 'src', outputVoltage: 48, inputPowerFactor: 0.99, loss: { model: 'constant', efficiency: 0.95 } },
    { id: 'ld', name: 'Load', kind: 'dc-load', from: 'rect', power: 100 },
  ],
});

describe('final guard of the solve', () => {
  it('passes a finite result through unchanged', () => {
    const o = solveProject(chain('Clean'));
    expect(o.ok).toBe(true);
  });

  it('refuses a result holding one NaN, naming element, name and field', () => {
    const o = solveProject(chain('Poisoned'));
    if (o.ok) throw new Error('a result holding NaN was shown');
    expect(o.problems.map((p) => [p.code, p.elementId, p.field])).toEqual([['non-finite', 'rect', 'output.current']]);
    expect(o.problems[0]!.message).toContain('"Front rectifier"');
    expect(o.problems[0]!.message).toContain('output current (not a number)');
    expect(o.problems[0]!.message).toContain('Nothing computed is shown');
  });
});
