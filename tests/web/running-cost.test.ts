// The energy price and hours a year moved from a preference on the device into the project file
// (`running`, core/model/study-settings.ts). Migration: a format-2 file without `running` still
// imports and opens, and the device's earlier setting fills it (shown and used) until the user
// changes a value, when the project gets the whole object; a project's own values win over the
// device's; export and import keep them; a value the engine refuses never enters the project and its
// message stays at the field. Check values: the project's own definitions (no outside source); the
// default 8760 h = 365 × 24, a leap year 8784 h = 366 × 24.
import { beforeEach, describe, expect, it } from 'vitest';
import { PROJECT_LEVEL } from '../../core/model/errors.ts';
import { demoProjects } from '../../core/demos/index.ts';
import { draft, fieldError, loadProject, resultsState, undo, type DraftProject } from '../../web/state/editor.ts';
import { costInForce, energyPrice, operatingHours, parseCostPrefs, runningInForce } from '../../web/state/prefs.ts';
import { writeRunning } from '../../web/components/machines/LossCost.tsx';
import { costSettingsOf } from '../../core/studies/economics.ts';
import { buildExport, exportText, parseImportText } from '../../web/storage/file-format.ts';

const loss = { model: 'constant', efficiency: 0.9 };
function chain(running?: Record<string, unknown>): DraftProject {
  return {
    format: 'joulepath-project',
    version: 2,
    name: 'Pump shed',
    elements: [
      { id: 'bank', kind: 'battery', voltage: 48 },
      { id: 'psu', kind: 'dc-dc', from: 'bank', outputVoltage: 12, loss },
      { id: 'lamp', kind: 'dc-load', from: 'psu', power: 450 },
    ],
    ...(running ? { running } : {}),
  };
}

beforeEach(() => {
  // The device's earlier setting, as the machines panel kept it before the move.
  energyPrice.value = 0.31;
  operatingHours.value = 4000;
});

describe('the device setting a project without `running` starts from', () => {
  it('an older stored preference is still read as before', () => {
    expect(parseCostPrefs(JSON.stringify({ pricePerKWh: 0.31, hoursPerYear: 4000 }))).toEqual({ pricePerKWh: 0.31, hoursPerYear: 4000 });
  });

  it('a format-2 file without `running` (every demo) imports, and the preference fills it', () => {
    for (const d of demoProjects) {
      // The harbour clinic demo prices its standing by (`running`): taken out, it is a file without it.
      const { running: _running, ...project } = d.project as unknown as Record<string, unknown>;
      const imported = parseImportText(JSON.stringify(project));
      expect(imported.ok, d.id).toBe(true);
      if (!imported.ok) continue;
      expect(runningInForce(imported.project)).toEqual({ price: 0.31, hours: 4000, fromDevice: true });
      expect(costInForce(imported.project)).toEqual({ pricePerKWh: 0.31, hoursPerYear: 4000 });
    }
  });

  it('a night price in the file: the page prices the losses at the day\'s mean, as the engine and the CLI do', () => {
    // Time-weighted mean (core/model/tariff.ts): 16 h at 0.30 + 8 h at 0.12 over 24 h = 0.24 (worked by hand).
    const p = chain({ energyPricePerKWh: 0.3, nightPricePerKWh: 0.12, dayStartHour: 7, dayEndHour: 23, hoursPerYear: 2000 });
    expect(costInForce(p)!.pricePerKWh).toBeCloseTo(0.24, 12);
    expect(costInForce(p)).toEqual(costSettingsOf(p as never));
    // The price field still shows the day price as given.
    expect(runningInForce(p).price).toBe(0.3);
  });

  it("a project's own values win; its hours default to 8760 h, the engine's and the CLI's default", () => {
    expect(runningInForce(chain({ energyPricePerKWh: 0.12, hoursPerYear: 2000 }))).toEqual({ price: 0.12, hours: 2000, fromDevice: false });
    expect(runningInForce(chain({ energyPricePerKWh: 0.12 }))).toEqual({ price: 0.12, hours: 8760, fromDevice: false });
    // A project with `running` but no price has no cost, whatever the device holds.
    expect(costInForce(chain({ hoursPerYear: 2000 }))).toBeNull();
  });

  it('no device price and no project price: no cost', () => {
    energyPrice.value = null;
    expect(costInForce(chain())).toBeNull();
  });
});

describe('writing a running setting', () => {
  beforeEach(() => loadProject(chain(), { kind: 'new', title: 'test' }));

  it('the first value typed writes the whole object: the value and the other setting as it was shown', () => {
    expect(writeRunning(draft.value!, 'energyPricePerKWh', 0.25, 'Energy price per kWh')).toBeNull();
    expect(draft.value!['running']).toEqual({ energyPricePerKWh: 0.25, hoursPerYear: 4000 });
    // The device setting follows, so a new project starts from the last price typed.
    expect(energyPrice.value).toBe(0.25);
    expect(writeRunning(draft.value!, 'hoursPerYear', 6000, 'Hours per year at this load')).toBeNull();
    expect(draft.value!['running']).toEqual({ energyPricePerKWh: 0.25, hoursPerYear: 6000 });
    undo();
    expect(draft.value!['running']).toEqual({ energyPricePerKWh: 0.25, hoursPerYear: 4000 });
  });

  it('a value the engine refuses stays out of the project, its message at the field, the results marked out of date', () => {
    expect(writeRunning(draft.value!, 'energyPricePerKWh', 0.25, 'Energy price per kWh')).toBeNull();
    expect(resultsState.value).toBe('current');
    const message = writeRunning(draft.value!, 'hoursPerYear', 9000, 'Hours per year at this load');
    expect(message).toMatch(/must not exceed 8784/);
    expect(fieldError(PROJECT_LEVEL, 'running.hoursPerYear')).toBe(message);
    expect(draft.value!['running']).toEqual({ energyPricePerKWh: 0.25, hoursPerYear: 4000 });
    expect(resultsState.value).toBe('stale');
    // The device setting keeps the last good value.
    expect(operatingHours.value).toBe(4000);
  });

  it('refused on a project without `running` too: the message at the field typed in, nothing written', () => {
    const message = writeRunning(draft.value!, 'energyPricePerKWh', -1, 'Energy price per kWh');
    expect(message).toMatch(/must not be negative/);
    expect(fieldError(PROJECT_LEVEL, 'running.energyPricePerKWh')).toBe(message);
    expect(fieldError(PROJECT_LEVEL, 'running')).toBeUndefined();
    expect(draft.value!['running']).toBeUndefined();
  });

  it('export and import keep the running settings', () => {
    writeRunning(draft.value!, 'energyPricePerKWh', 0.25, 'Energy price per kWh');
    const text = exportText(buildExport(draft.value!, { exportedAt: new Date(0), appVersion: 'test' }));
    const back = parseImportText(text);
    expect(back.ok).toBe(true);
    if (back.ok) expect(back.project['running']).toEqual({ energyPricePerKWh: 0.25, hoursPerYear: 4000 });
  });
});
