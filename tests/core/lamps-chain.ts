/**
 * The hand chain of the cost tests (tests/core/lifetime-profile.test.ts, loss-cost-profile.test.ts): 230 V
 * supply, rectifier of constant 90 % (loses 100 W at the 900 W load "Lamps"), with the project's `running`
 * settings and, when given, its `backup` settings (the load profile whose day splits the prices).
 */
export const lampsChain = (name: string, running: Record<string, unknown>, backup?: unknown) => ({
  format: 'joulepath-project',
  version: 2,
  name,
  elements: [
    { id: 'src', kind: 'grid', phases: 1, voltage: 230, frequency: 50 },
    { id: 'psu', name: 'Power supply', kind: 'rectifier', from: 'src', outputVoltage: 48, inputPowerFactor: 1, loss: { model: 'constant', efficiency: 0.9 } },
    { id: 'lamp', name: 'Lamps', kind: 'dc-load', from: 'psu', power: 900 },
  ],
  running,
  ...(backup !== undefined ? { backup } : {}),
});
