/**
 * The words users read for the file format's fields: the form label of every field of every kind
 * (and of the project's own fields and study settings), one table the engine's messages and the
 * page's forms share. The forms (web/editor/fields/) show these labels; tests/web/field-labels.test.ts
 * checks that every form field's label is the one here, so a label is changed in one place for both.
 * Keys are the fields' paths inside the element ("loss.efficiency"); a path that is a group of
 * fields (a loss model given one of several ways) carries the group's label.
 *
 * `Problem.field` stays the machine path (the page marks the field with it); messages and the CLI
 * word it with `fieldLabel`.
 */
import type { ElementKind } from './project.ts';

/** The trade name of each element kind, for an element users left unnamed ("Inverter #4"). */
export const KIND_LABELS: Readonly<Record<ElementKind, string>> = {
  grid: 'Utility supply',
  generator: 'Generator',
  battery: 'Battery bank',
  rectifier: 'Rectifier',
  'dc-dc': 'DC–DC converter',
  'dc-bus': 'DC bus',
  inverter: 'Inverter',
  transformer: 'Transformer',
  drive: 'Variable-frequency drive',
  motor: 'Motor',
  cable: 'Cable',
  generic: 'Converter',
  'transfer-switch': 'Transfer switch',
  'network-load': 'Load from R, L, C',
  'dc-load': 'DC load',
  'ac-load': 'AC load',
  'ac-va-load': 'AC load (VA)',
  'dc-current-load': 'DC load (amperes)',
  'ac-current-load': 'AC load (amperes)',
  'shaft-load': 'Shaft load',
  pump: 'Pump',
  fan: 'Fan',
};

/** The loss model's fields, the same in every converter's form (core/physics/loss-model.ts). */
const CONVERTER_LOSS_LABELS: Readonly<Record<string, string>> = {
  loss: "Loss model",
  "loss.efficiency": "Efficiency (%)",
  "loss.idleLoss": "Idle draw (no-load loss)",
  "loss.ratedPower": "Rated output power",
  "loss.points": "Datasheet points",
  "loss.p0": "P0, no-load loss",
  "loss.k1": "k1, loss per W (proportional)",
  "loss.k2": "k2, loss per W² (resistive)",
};

/** Form labels per kind (and "project" for the project's own fields and study settings). */
export const FIELD_LABELS: Readonly<Record<ElementKind | 'project', Readonly<Record<string, string>>>> = {
  grid: {
    name: "Name",
    phases: "Phases",
    voltage: "Open-circuit voltage",
    frequency: "Frequency",
    resistance: "Source resistance per phase",
    reactance: "Source reactance per phase",
    ratedApparentPower: "Supply rating",
    subtransientReactancePercent: "Subtransient reactance X″d (%)",
    transientReactancePercent: "Transient reactance X′d (%)",
    maxDipPercent: "Largest dip allowed while a motor starts (%)",
    shortCircuitPower: "Short-circuit power at the supply point",
    shortCircuitRToX: "R/X of the supply",
    voltageTolerancePercent: "Voltage tolerance of the LV system",
  },
  generator: {
    name: "Name",
    phases: "Phases",
    voltage: "Open-circuit voltage",
    frequency: "Frequency",
    resistance: "Source resistance per phase",
    reactance: "Source reactance per phase",
    ratedApparentPower: "Generator rating",
    subtransientReactancePercent: "Subtransient reactance X″d (%)",
    transientReactancePercent: "Transient reactance X′d (%)",
    maxDipPercent: "Largest dip allowed while a motor starts (%)",
    shortCircuitPower: "Short-circuit power at the supply point",
    shortCircuitRToX: "R/X of the supply",
    voltageTolerancePercent: "Voltage tolerance of the LV system",
  },
  battery: {
    name: "Name",
    bank: "Battery given as",
    "bank.chemistry": "Chemistry",
    "bank.series": "Cells (or blocks) in series",
    "bank.strings": "Strings in parallel",
    "bank.cellsPerBlock": "Cells per block",
    "bank.capacityAh": "Capacity of one string",
    "bank.initialSoc": "State of charge at the start (%)",
    "bank.overrides.nominalCellVoltage": "Nominal cell voltage",
    "bank.overrides.endOfDischargeCellVoltage": "Cut-off cell voltage",
    "bank.overrides.usableDepthOfDischarge": "Usable depth of discharge (%)",
    "bank.overrides.peukertExponent": "Peukert exponent",
    "bank.overrides.internalResistanceOhmAh": "Cell resistance × capacity",
    "bank.overrides.roundTripEfficiency": "Round-trip efficiency (%)",
    "bank.overrides.ratedHours": "Capacity rated at (hours)",
    "bank.overrides.chargeCellVoltage": "Charge (absorption) cell voltage",
    "bank.overrides.floatCellVoltage": "Float cell voltage",
    "bank.overrides.maxChargeCRate": "Maximum charge rate",
    "bank.overrides.maxDischargeCRate": "Maximum discharge rate",
    "bank.overrides.minChargeTemperatureC": "Lowest charging temperature",
    "bank.floatCurrent": "Float current of one string",
    voltage: "Open-circuit voltage",
    internalResistance: "Internal resistance of the bank",
    bankFuse: "Fuse or breaker at the bank",
    "bankFuse.interruptingRating": "Interrupting rating (breaking capacity)",
  },
  rectifier: {
    name: "Name",
    outputVoltage: "DC output voltage",
    inputPowerFactor: "Input power factor (0–1)",
    inputPfSense: "Input power factor sense",
    ...CONVERTER_LOSS_LABELS,
    ratedOutputCurrent: "Rated DC output current",
  },
  "dc-dc": {
    name: "Name",
    outputVoltage: "Output voltage",
    ...CONVERTER_LOSS_LABELS,
    ratedOutputPower: "Rated continuous output power",
    minInputVoltage: "Lowest input voltage",
  },
  "dc-bus": {
    name: "Name",
    fixedLoss: "Fixed loss of the bus",
  },
  "transfer-switch": {
    name: "Name",
    contactResistance: "Contact resistance per pole",
    controlPower: "Control power",
    ratedCurrent: "Rated current",
    transferTime: "Transfer time",
  },
  inverter: {
    name: "Name",
    phases: "Phases",
    outputVoltage: "AC output voltage",
    frequency: "Output frequency",
    ...CONVERTER_LOSS_LABELS,
    lowVoltageCutoff: "Low-voltage cut-off (DC input)",
    ratedOutputPower: "Rated continuous output power",
    surge: "Surge rating",
    "surge.apparentPower": "Surge apparent power",
    "surge.durationSeconds": "For how long",
    passThroughLimit: "Pass-through limit (inverter-charger)",
  },
  transformer: {
    name: "Name",
    ratedApparentPower: "Rating",
    primaryVoltage: "Primary voltage",
    secondaryVoltage: "Secondary voltage",
    noLoadLoss: "No-load (core) loss",
    loadLoss: "Load (copper) loss at rated current",
    impedancePercent: "Impedance (%)",
  },
  drive: {
    name: "Name",
    outputVoltage: "Output voltage",
    outputFrequency: "Output frequency",
    inputPowerFactor: "Input displacement power factor (0–1)",
    currentThd: "Input current THD (%)",
    motorRatedFrequency: "Motor rated frequency",
    singlePhaseRating: "Output rating on a single-phase supply",
    ratedInputCurrent: "Rated input current",
    ...CONVERTER_LOSS_LABELS,
    standardLoss: "Drive losses",
    "standardLoss.ratedApparentPower": "Drive rating",
    "standardLoss.basis": "Points are for",
    "standardLoss.points": "Losses at the points",
    "standardLoss.points.0": "Loss at 0 % speed, 25 % torque",
    "standardLoss.points.1": "Loss at 0 % speed, 50 % torque",
    "standardLoss.points.2": "Loss at 0 % speed, 100 % torque",
    "standardLoss.points.3": "Loss at 50 % speed, 25 % torque",
    "standardLoss.points.4": "Loss at 50 % speed, 50 % torque",
    "standardLoss.points.5": "Loss at 50 % speed, 100 % torque",
    "standardLoss.points.6": "Loss at 90 or 100 % speed, 50 % torque",
    "standardLoss.points.7": "Loss at 90 or 100 % speed, 100 % torque",
  },
  motor: {
    name: "Name",
    ratedOutput: "Rated shaft output",
    ratedVoltage: "Rated voltage",
    ratedFrequency: "Rated frequency",
    poles: "Poles",
    ratedSpeed: "Rated speed",
    serviceFactor: "Service factor",
    loss: "Loss model",
    powerFactor: "Power factor model",
    nameplate: "Efficiency from",
    efficiencyClass: "Efficiency class",
    ratedPowerFactor: "Full-load power factor (0–1)",
    "nameplate.efficiency": "Full-load efficiency (%)",
    "nameplate.powerFactor": "Full-load power factor (0–1)",
    "nameplate.current": "Full-load current",
    "loss.efficiency": "Efficiency (%)",
    "loss.idleLoss": "Idle draw (no-load loss)",
    "loss.ratedPower": "Rated shaft power",
    "loss.points": "Datasheet points",
    "loss.p0": "P0, no-load loss",
    "loss.k1": "k1, loss per W (proportional)",
    "loss.k2": "k2, loss per W² (resistive)",
    "powerFactor.powerFactor": "Power factor (0–1)",
    "powerFactor.points": "Power factor points",
    starting: "Motor starting",
    "starting.method": "Starting method",
    "starting.codeLetter": "Locked-rotor code letter (NEC Table 430.7(B))",
    "starting.startingCurrentRatio": "Starting current ratio I_A/I_N",
    "starting.lockedRotorCurrent": "Locked-rotor current",
    "starting.currentLimit": "Soft-starter current limit (× full-load current)",
    "starting.startingPowerFactor": "Power factor at locked rotor (0–1)",
    "starting.startSeconds": "Time to reach speed",
    "starting.minTerminalVoltagePercent": "Lowest terminal voltage while starting (% of rated)",
  },
  cable: {
    name: "Name",
    length: "Route length (one way)",
    parallelSets: "Sets in parallel",
    conductor: "Conductor",
    "conductor.material": "Conductor material",
    "conductor.size": "Conductor size",
    "conductor.ambient": "Ambient temperature",
    "conductor.designCurrentBasis": "Design current from",
    "conductor.designCurrent": "Design current (entered)",
    "conductor.continuous": "Continuous load (size at 125 %)",
    "conductor.maxDropPercent": "Allowed voltage drop (%)",
    "conductor.insulationRating": "Insulation rating (Table 310.16 column)",
    "conductor.terminationRating": "Termination rating",
    "conductor.raceway": "Raceway (Chapter 9 Table 9)",
    "conductor.currentCarryingConductors": "Current-carrying conductors in the raceway",
    "conductor.multioutletBranch": "Branch circuit with several receptacles",
    "conductor.motorDevice": "Motor branch device",
    "conductor.insulation": "Insulation",
    "conductor.installationMethod": "Installation method",
    "conductor.loadedConductors": "Loaded conductors",
    "conductor.groupedCircuits": "Circuits grouped together",
    "conductor.deviceType": "Overload device",
    resistancePerKm: "Resistance per conductor",
    reactancePerKm: "Reactance per conductor",
    protection: "Fuse or breaker at the sending end",
    "protection.interruptingRating": "Interrupting rating (breaking capacity)",
  },
  generic: {
    name: "Name",
    inputKind: "Input",
    outputKind: "Output",
    outputVoltage: "Output voltage",
    outputFrequency: "Output frequency",
    inputPowerFactor: "Input power factor (0–1)",
    inputPfSense: "Input power factor sense",
    ...CONVERTER_LOSS_LABELS,
  },
  "dc-load": {
    name: "Name",
    power: "Power drawn",
  },
  "ac-load": {
    name: "Name",
    power: "Real power drawn",
    powerFactor: "Power factor (0–1)",
    pfSense: "Power factor sense",
  },
  "ac-va-load": {
    name: "Name",
    apparentPower: "Apparent power drawn",
    powerFactor: "Power factor (0–1)",
    pfSense: "Power factor sense",
  },
  "dc-current-load": {
    name: "Name",
    current: "Current drawn",
  },
  "ac-current-load": {
    name: "Name",
    current: "Line current drawn (rms)",
    powerFactor: "Power factor (0–1)",
    pfSense: "Power factor sense",
  },
  "shaft-load": {
    name: "Name",
    power: "Shaft power",
  },
  "network-load": {
    name: "Name",
    network: "Circuit",
    connection: "Three-phase connection",
  },
  pump: {
    name: "Name",
    ratedFlow: "Rated flow",
    ratedHead: "Rated head",
    shutoffHead: "Shut-off head (zero flow)",
    efficiency: "Pump efficiency (%)",
    density: "Fluid density",
    staticHead: "Static head of the system",
    flow: "Operating flow",
    control: "Flow control",
  },
  fan: {
    name: "Name",
    ratedFlow: "Rated air flow",
    ratedPressure: "Rated fan pressure",
    shutoffPressure: "Shut-off pressure (zero flow)",
    efficiency: "Fan efficiency (%)",
    density: "Air density at the fan",
    flow: "Operating air flow",
    control: "Air flow control",
  },
  project: {
    name: "Project name",
    description: "Description",
    client: "Client",
    site: "Site",
    preparedBy: "Prepared by",
    variants: "Options to compare",
    "dropLimits.basis": "Voltage-drop limits from",
    "dropLimits.perLinkPercent": "Allowed drop per link (%)",
    "dropLimits.totalPercent": "Allowed drop in total (%)",
    "backup.targetRuntimeHours": "Target runtime",
    "backup.designMargin": "Design margin",
    "backup.agingFactor": "Aging factor",
    "backup.temperatureC": "Cell temperature",
    "backup.stateOfHealth": "State of health",
    "backup.chargerCurrent": "Charger current",
    "backup.targetRechargeHours": "Target recharge time",
    "backup.chargerEfficiency": "Charger efficiency",
    "backup.timeStepSeconds": "Time step",
    "backup.horizonHours": "Study length",
    "backup.standardCapacitiesAh": "Standard capacities",
    "backup.profile": "Load profile",
    "running.energyPricePerKWh": "Energy price per kWh",
    "running.hoursPerYear": "Hours per year at this load",
    "running.nightPricePerKWh": "Night energy price per kWh",
    "running.dayStartHour": "Day price from (hour)",
    "running.dayEndHour": "Day price until (hour)",
    "running.dayHoursFromProfile": "Split the day and night hours as the load profile uses them",
    "running.years": "Years of service",
    "running.discountRate": "Discount rate per year (%)",
    "running.gridCo2KgPerKWh": "Grid CO₂ per kWh (kg)",
    "running.generator": "Generator fuel and outages",
    "running.generator.quarterLoadLitresPerHour": "Generator fuel at ¼ load (L/h)",
    "running.generator.halfLoadLitresPerHour": "Generator fuel at ½ load (L/h)",
    "running.generator.fullLoadLitresPerHour": "Generator fuel at full load (L/h)",
    "running.generator.ratedPower": "Generator rated power",
    "running.generator.outageHoursPerYear": "Outage hours per year",
    "running.generator.outagesPerYear": "Outages per year",
    "running.generator.fuelPricePerLitre": "Fuel price per litre",
    "backup.profile.startHour": "Outage starts at",
    "backup.profile.segments": "Time-of-day segments",
    "backup.profile.duty": "Duty cycles",
    "pumpDuty.pump": "Pump or fan of the duty study",
    "pumpDuty.duty": "Duty points",
    "standby.targetRechargeHours": "Recharge time after an outage",
    "standby.rechargeAh": "Charge to put back",
    "standby.chargeReturnFactor": "Charge-return factor",
    "standby.moduleCurrent": "Rectifier module current",
    "standby.redundancy": "Redundant modules",
    "standby.outageHoursPerYear": "Outage hours per year",
    "spread.samples": "Samples",
    "spread.seed": "Seed",
    "spread.capacityPercent": "Capacity tolerance (± %)",
    "spread.agingPercent": "Capacity lost to aging (up to %)",
    "spread.temperatureC": "Cell temperature range (± °C)",
    "spread.efficiencyPoints": "Converter efficiency (± points)",
    "spread.loadPercent": "Load levels (± %)",
    "spread.endVoltagePerCell": "End voltage per cell (± V)",
    optionSearch: "Find the option",
    "optionSearch.targetRuntimeHours": "Runtime to reach",
    "optionSearch.maxLossW": "Highest losses",
    "optionSearch.order": "List first",
    "optionSearch.systemVoltages": "System voltages to try",
    "optionSearch.strings": "Strings to try",
    "optionSearch.strings.bank": "Bank to try strings in",
    "optionSearch.strings.counts": "Strings to try",
    "optionSearch.strings.pricePerString": "Price of one string",
    "optionSearch.cables": "Conductor sizes to try",
    "optionSearch.cables.cable": "Cable to try sizes on",
    "optionSearch.cables.sizes": "Sizes to try",
    "optionSearch.cables.fromSize": "Smallest size to try",
    "optionSearch.cables.toSize": "Largest size to try",
    "optionSearch.cables.prices": "Price at each size",
    "optionSearch.inverters": "Inverters to try",
    "optionSearch.inverters.element": "Element to swap",
    "optionSearch.inverters.alternatives": "Alternatives to try",
    "optionSearch.inverters.keepCurrent": "Keep the current one among them",
  },
};

/** Labels of the element base's fields that every kind has beside its own (core/model/element-base.ts). */
const ELEMENT_BASE_LABELS: Readonly<Record<string, string>> = {
  price: 'Purchase price',
};

/** Words for the keys no form shows (list entries, parts of a field): "loadFraction" → "load fraction". */
const KEY_WORDS: Readonly<Record<string, string>> = {
  loadFraction: 'load fraction',
  p0: 'no-load loss',
  k1: 'linear loss term',
  k2: 'resistive loss term',
  // The power-factor correction's request (the CLI's --correct-pf, the machines panel's form).
  at: 'element to correct',
  targetPowerFactor: 'target power factor',
};

/** A path users have no label for, in plain words: `segments.0.loads` → "segments item 1 loads". */
export function pathWords(path: readonly string[]): string {
  return path
    .map((key) => (/^\d+$/.test(key) ? `item ${Number(key) + 1}` : (Object.hasOwn(KEY_WORDS, key) ? KEY_WORDS[key] : undefined) ?? key.replace(/([a-z0-9])([A-Z])/g, '$1 $2').toLowerCase()))
    .join(' ');
}

/**
 * The label of a field as the form shows it: the longest labelled path the field starts with, then
 * the rest in words ("Datasheet points, item 2 load fraction"). `kind` is the element's kind, or
 * "project" for the project's own fields; an unknown kind or path gives the path in words.
 */
export function fieldLabel(kind: string | undefined, field: string): string {
  const parts = field.split('.');
  const table = kind !== undefined && Object.hasOwn(FIELD_LABELS, kind) ? FIELD_LABELS[kind as ElementKind] : undefined;
  if (table) {
    for (let n = parts.length; n > 0; n--) {
      const path = parts.slice(0, n).join('.');
      if (Object.hasOwn(table, path)) return n === parts.length ? table[path]! : `${table[path]!}, ${pathWords(parts.slice(n))}`;
    }
    if (kind !== 'project' && Object.hasOwn(ELEMENT_BASE_LABELS, field)) return ELEMENT_BASE_LABELS[field]!;
  }
  return pathWords(parts);
}

/** The trade name of a kind; an unknown kind is shown as given. */
export function kindLabel(kind: string): string {
  return Object.hasOwn(KIND_LABELS, kind) ? KIND_LABELS[kind as ElementKind] : kind;
}

const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/** How messages name the elements of a project given as untrusted data. */
export interface ElementWords {
  /** id → the element's name, or its kind's label and place ("Inverter #4") when it has none. */
  readonly names: ReadonlyMap<string, string>;
  /** id → kind (for field labels). */
  readonly kinds: ReadonlyMap<string, string>;
}

/** The words for every element of a project (ids that cannot be read are left out). */
export function elementWords(project: unknown): ElementWords {
  const names = new Map<string, string>();
  const kinds = new Map<string, string>();
  const elements = isRecord(project) ? project['elements'] : undefined;
  if (Array.isArray(elements)) {
    elements.forEach((e, i) => {
      if (!isRecord(e) || typeof e['id'] !== 'string') return;
      const kind = typeof e['kind'] === 'string' ? e['kind'] : undefined;
      if (kind !== undefined) kinds.set(e['id'], kind);
      const name = typeof e['name'] === 'string' && e['name'].trim() !== '' ? e['name'] : `${kind !== undefined ? kindLabel(kind) : 'Element'} #${i + 1}`;
      if (!names.has(e['id'])) names.set(e['id'], name);
    });
  }
  return { names, kinds };
}

/** An element as a message names it: its name in quotes, else its id (a project that could not be read). */
export function elementName(words: ElementWords | undefined, id: string): string {
  return `"${words?.names.get(id) ?? id}"`;
}
