import { readFileSync } from 'node:fs';
import { runBackupStudy } from '../../core/battery/study.ts';
const demo = JSON.parse(readFileSync('core/demos/hillside-relay-hut.json', 'utf8'));
const run = (label: string, f: (p: any) => void) => {
  const p = structuredClone(demo); f(p);
  const t = performance.now();
  let out: any;
  try { out = runBackupStudy(p); } catch (e) { out = { threw: String(e).slice(0, 150) }; }
  const ms = performance.now() - t;
  const mem = (process.memoryUsage().heapUsed / 1e6).toFixed(0);
  console.log(label, ms.toFixed(0), 'ms', mem, 'MB', out.threw ?? (out.ok ? `ok ${out.study.discharge.series.time.length} samples, runtime ${(out.study.discharge.runtimeSeconds/3600).toFixed(2)} h` : JSON.stringify(out.problems.map((x: any) => [x.field, x.message]))));
};
run('demo', () => {});
run('two 1e-5 h segments', (p) => { p.backup.profile = { kind: 'segments', repeat: true, segments: [{ durationHours: 1e-5, loads: { lights: 10 } }, { durationHours: 1e-5 }] }; });
run('1e-7 h', (p) => { p.backup.profile = { kind: 'segments', repeat: true, segments: [{ durationHours: 1e-7, loads: { lights: 10 } }, { durationHours: 1e-7 }] }; });
run('5e-324 h', (p) => { p.backup.profile = { kind: 'segments', repeat: true, segments: [{ durationHours: 5e-324, loads: { lights: 10 } }] }; });
run('duty 1e-6 min', (p) => { p.backup.profile.duty[0].periodMinutes = 1e-6; p.backup.profile.duty[0].onMinutes = 1e-7; });
run('duty at limit', (p) => { p.backup.profile.duty[0].periodMinutes = 2 * 96 * 60 / 95000; p.backup.profile.duty[0].onMinutes = 0.5 * 2 * 96 * 60 / 95000; });
run('many states', (p) => { p.backup.profile.duty = Array.from({ length: 12 }, (_, i) => ({ load: i % 2 ? 'lights' : 'fridge', periodMinutes: 7 + i * 1.37, onMinutes: 3 })); p.backup.profile.kind='daily'; p.backup.profile.segments = Array.from({length: 200}, (_, i) => ({ startHour: i * 0.1, loads: { lights: i, radios: 200 - i } })); });
run('1e6 steps', (p) => { p.backup.timeStepSeconds = 96 * 3600 / 999000; delete p.backup.targetRuntimeHours; });
