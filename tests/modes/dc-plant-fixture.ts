/**
 * The hand-worked 48 V DC plant of tests/modes/dc-plant.test.ts, recharge-ah.test.ts and cable-sizes.test.ts
 * (invented data): supply → rectifier (54 V, constant 90 %) → DC bus with a bank of 24 flooded cells,
 * 200 Ah, float current 0.2 A (the maker's figure of these tests) → a 30 A radio. `extra` adds the
 * project's settings (standby, running, backup); each call builds a fresh copy (tests change it).
 */
export const dcPlant = (extra: Record<string, unknown> = {}) => ({
  format: 'joulepath-project',
  version: 2,
  name: 'DC plant',
  elements: [
    { id: 'grid', kind: 'grid', phases: 1, voltage: 230, frequency: 50 },
    { id: 'rect', name: 'Rectifier', kind: 'rectifier', from: 'grid', outputVoltage: 54, inputPowerFactor: 1, loss: { model: 'constant', efficiency: 0.9 } },
    { id: 'bus', name: 'DC bus', kind: 'dc-bus', from: 'rect', fixedLoss: 0 },
    { id: 'bank', name: 'Bank', kind: 'battery', from: 'bus', bank: { chemistry: 'flooded-lead-acid', series: 24, capacityAh: 200, floatCurrent: 0.2 } },
    { id: 'radio', name: 'Radio', kind: 'dc-current-load', from: 'bus', current: 30 },
  ],
  ...extra,
});
