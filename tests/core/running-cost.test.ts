/**
 * The project's `running` settings (energy price per kWh, hours a year at the solved operating point):
 * the file format takes them, validation refuses what the cost study could not use (naming the field
 * by its form label), a format-2 file without them still opens, and the command-line solver reads them
 * and prints what the losses cost a year. Check values are worked by hand beside each case (the kWh:
 * 1 kWh = 1000 W × 1 h; a tariff per kWh; common practice (no source)), and the converter's loss from
 * its constant efficiency, P_in = P_out / η (the loss model's definition).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { formatProblem, PROJECT_LEVEL } from '../../core/model/errors.ts';
import { solveProject, validateProject } from '../../core/solve/index.ts';
import { costSettingsOf, HOURS_IN_YEAR, lossCostPerYear } from '../../core/studies/economics.ts';
import { demoProjects } from '../../core/demos/index.ts';
import { projectPumpDuty } from '../../core/studies/machines/pump-duty.ts';
import { onSolved } from './solved.ts';

const TSX = join('node_modules', '.bin', 'tsx');
const run = (...args: string[]) => spawnSync(TSX, ['core/cli/cli.ts', ...args], { encoding: 'utf8' });
const scratch = mkdtempSync(join(tmpdir(), 'joulepath-running-'));

/**
 * A stiff 48 V source, a converter of constant 90 % efficiency to 12 V, a 450 W load: the converter
 * takes 450 / 0.9 = 500 W and loses 50 W; nothing else loses anything (stiff source, no cables).
 */
const chain = (running?: Record<string, unknown>) => ({
  format: 'joulepath-project',
  version: 2,
  name: 'Cost by hand',
  elements: [
    { id: 'src', kind: 'battery', voltage: 48 },
    { id: 'psu', name: 'Power supply', kind: 'dc-dc', from: 'src', outputVoltage: 12, loss: { model: 'constant', efficiency: 0.9 } },
    { id: 'lamp', kind: 'dc-load', from: 'psu', power: 450 },
  ],
  ...(running ? { running } : {}),
});

function write(name: string, project: unknown): string {
  const file = join(scratch, name);
  writeFileSync(file, JSON.stringify(project));
  return file;
}

describe('the running settings in the file', () => {
  it('are read as the cost settings: the price and the hours, 8760 h when the hours are left out', () => {
    expect(costSettingsOf(chain({ energyPricePerKWh: 0.3, hoursPerYear: 4000 }) as never)).toEqual({ pricePerKWh: 0.3, hoursPerYear: 4000 });
    // 365 × 24 = 8760 h, a common year all year round (the default).
    expect(costSettingsOf(chain({ energyPricePerKWh: 0.3 }) as never)).toEqual({ pricePerKWh: 0.3, hoursPerYear: 8760 });
    expect(HOURS_IN_YEAR).toBe(8760);
    // Hours alone give no cost: there is no price to cost them at.
    expect(costSettingsOf(chain({ hoursPerYear: 4000 }) as never)).toBeNull();
  });

  it('a format-2 file without them (every demo, its `running` taken out) still opens and solves; it simply has no cost', () => {
    for (const demo of demoProjects) {
      // The harbour clinic demo prices its standing by (`running`); taken out, it is a file without them.
      const { running: _running, ...project } = demo.project as unknown as Record<string, unknown>;
      const d = { project };
      expect('running' in (d.project as object)).toBe(false);
      expect(validateProject(d.project).ok).toBe(true);
      expect(costSettingsOf(d.project as never)).toBeNull();
    }
    expect(validateProject(chain()).ok).toBe(true);
  });

  it('a negative price, hours past a leap year or an unknown key are refused at their field, named by the form label', () => {
    const bad = validateProject(chain({ energyPricePerKWh: -0.1, hoursPerYear: 9000, tariff: 2 }));
    expect(bad.ok).toBe(false);
    if (bad.ok) return;
    const fields = bad.problems.map((p) => [p.elementId, p.field]);
    expect(fields).toContainEqual([PROJECT_LEVEL, 'running.energyPricePerKWh']);
    expect(fields).toContainEqual([PROJECT_LEVEL, 'running.hoursPerYear']);
    expect(fields).toContainEqual([PROJECT_LEVEL, 'running.tariff']);
    const words = bad.problems.map((p) => formatProblem(p, chain()));
    expect(words).toContain('Project, Energy price per kWh: must not be negative (a price per kWh in your currency)');
    // 366 × 24 = 8784 h, a leap year, is the most a year holds.
    expect(words).toContain('Project, Hours per year at this load: must not exceed 8784 h, a leap year (8760 runs all year)');
    // The limits are the cost study's own: 8784 h and 0 are taken.
    expect(validateProject(chain({ energyPricePerKWh: 0, hoursPerYear: 8784 })).ok).toBe(true);
  });

  it('the engine: 50 W lost for 4000 h at 0.30 per kWh is 200 kWh, 60.00 a year', () => {
    const solved = solveProject(chain({ energyPricePerKWh: 0.3, hoursPerYear: 4000 }));
    if (!solved.ok) throw new Error(JSON.stringify(solved.problems));
    const cost = lossCostPerYear(solved.result, costSettingsOf(solved.project)!);
    if (!cost.ok) throw new Error('refused');
    // 450 W / 0.9 − 450 W = 50 W (constant efficiency); 50 W × 4000 h = 200 kWh; × 0.30 = 60.00 (by hand).
    expect(cost.cost.totalLossW).toBeCloseTo(50, 6);
    expect(cost.cost.totalEnergyKWh).toBeCloseTo(200, 6);
    expect(cost.cost.totalCost).toBeCloseTo(60, 6);
  });
});

describe('the command-line solver reads the price and hours of the project', { timeout: 30_000 }, () => {
  it('prints the yearly cost of the losses: 50 W × 4000 h × 0.30 per kWh = 60.00', () => {
    const r = run(write('cost.json', chain({ energyPricePerKWh: 0.3, hoursPerYear: 4000 })));
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('What the losses cost per year (E = loss × 4000 h, at 0.3 per kWh');
    // The converter's row: 50 W, 200 kWh, 60.00 (by hand, above); the total is the same (nothing else loses).
    expect(r.stdout).toMatch(/Power supply\s+50\s+200\s+60\.00/);
    expect(r.stdout).toMatch(/All losses\s+50\s+200\s+60\.00/);
  });

  it('--json carries the cost under lossCost; without hours the year is 8760 h: 50 W × 8760 h = 438 kWh, × 0.30 = 131.40', () => {
    const r = run(write('cost-year.json', chain({ energyPricePerKWh: 0.3 })), '--json');
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout) as { lossCost: { hoursPerYear: number; totalEnergyKWh: number; totalCost: number } };
    expect(out.lossCost.hoursPerYear).toBe(8760);
    expect(out.lossCost.totalEnergyKWh).toBeCloseTo(438, 6);
    expect(out.lossCost.totalCost).toBeCloseTo(131.4, 6);
  });

  it("with a pump duty study, each flow-control method's yearly energy × the project's price", () => {
    const riverside = { ...(demoProjects.find((d) => d.id === 'riverside-pump-station')!.project as object), running: { energyPricePerKWh: 0.2 } };
    const duty = onSolved(projectPumpDuty, riverside as never);
    if (!duty.ok) throw new Error(JSON.stringify(duty.problems));
    const r = run(write('riverside-cost.json', riverside), '--json');
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout) as { pumpDutyCost: { speedControl: number; throttle: number; onOff: number; savingVsThrottle: number } };
    // Cost = E (Wh) ÷ 1000 × 0.20 per kWh, each method's energy from the pump duty study of the same file.
    expect(out.pumpDutyCost.speedControl).toBeCloseTo((duty.result.speedControl.energyWh / 1000) * 0.2, 6);
    expect(out.pumpDutyCost.throttle).toBeCloseTo((duty.result.throttle.energyWh / 1000) * 0.2, 6);
    expect(out.pumpDutyCost.onOff).toBeCloseTo((duty.result.onOff.energyWh / 1000) * 0.2, 6);
    // The choice: at this duty the drive costs less than throttling (affinity laws: power falls with the cube of speed).
    expect(out.pumpDutyCost.savingVsThrottle).toBeGreaterThan(0);
  });

  it('a project without a price prints no cost; a bad price is refused naming the field', () => {
    const none = run(write('no-cost.json', chain()));
    expect(none.status).toBe(0);
    expect(none.stdout).not.toContain('What the losses cost');
    const bad = run(write('bad-cost.json', chain({ energyPricePerKWh: -1 })));
    expect(bad.status).toBe(1);
    expect(bad.stdout + bad.stderr).toContain('Project, Energy price per kWh: must not be negative');
  });
});
