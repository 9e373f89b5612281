/** Test projects of the runtime spread (invented: a 48 V lithium bank, a DC-DC converter, one load). */
export function smallBankCase(extra: Record<string, unknown> = {}, loadW = 500) {
  return {
    format: 'joulepath-project',
    version: 2,
    name: 'Spread case',
    elements: [
      { id: 'bank', name: 'Bank', kind: 'battery', bank: { chemistry: 'lifepo4', series: 16, strings: 1, capacityAh: 100 } },
      { id: 'cable', name: 'Bank cable', kind: 'cable', from: 'bank', length: 2, resistancePerKm: 0.6 },
      {
        id: 'psu',
        name: 'Converter',
        kind: 'dc-dc',
        from: 'cable',
        outputVoltage: 24,
        loss: { model: 'curve', ratedPower: 1000, idleLoss: 5, points: [{ loadFraction: 0.2, efficiency: 0.9 }, { loadFraction: 0.5, efficiency: 0.94 }, { loadFraction: 1, efficiency: 0.93 }] },
      },
      { id: 'load', name: 'Load', kind: 'dc-load', from: 'psu', power: loadW },
    ],
    backup: { profile: { kind: 'constant' }, timeStepSeconds: 300, horizonHours: 48, temperatureC: 20, targetRuntimeHours: 6 },
    ...extra,
  };
}
