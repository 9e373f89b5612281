/**
 * Speed of the battery backup study: a 24-hour daily profile at 1-minute steps (1440 steps) through
 * a chain of ten stages fed by a battery bank, with two loads cycling on duty schedules. Run with
 * `npm run bench`; the median is reported in issue notes, not asserted here.
 */
import { bench, describe } from 'vitest';
import { simulateDischarge } from '../../core/studies/backup/discharge.ts';
import { batteryBenchProject } from '../battery/fixtures.ts';
import { onSolved } from '../core/solved.ts';

const project = batteryBenchProject();
const check = onSolved(simulateDischarge, project);
if (!check.ok) throw new Error(`bench project does not run: ${JSON.stringify(check.problems)}`);
if (check.result.endReason !== 'profile-complete' || check.result.series.time.length < 1440) {
  throw new Error(`bench project should run the whole 24 h profile, ended: ${check.result.endText}`);
}

describe('battery backup study', () => {
  bench('24 h profile, 1-minute steps, 10-stage chain, two duty-cycled loads', () => {
    onSolved(simulateDischarge, project);
  });
});
