/**
 * Display preferences as signals: unit system, number locale and colour theme. They change only
 * what is shown; the project and its solution are untouched (no re-solve on a switch).
 *
 * Kept in localStorage when the browser offers it. Reading or writing may fail (private mode, full
 * or disabled storage, a sandboxed frame); the page then keeps working with the values in memory.
 */
import { effect, signal } from '@preact/signals';
import { UNIT_SYSTEMS, type UnitSystem } from '../format/units.ts';
import { dayNightTariff, meanPrice, tariffOfRunning, type DayNightTariff } from '../../core/page.ts';

export type ThemeChoice = 'auto' | 'light' | 'dark';
export const THEME_CHOICES: readonly ThemeChoice[] = ['auto', 'light', 'dark'];

/** Locales offered in the page (any BCP 47 tag the browser supports also works when stored). */
export const LOCALE_CHOICES: readonly { tag: string; label: string }[] = [
  { tag: 'en-US', label: 'English (US) · 1,234.5' },
  { tag: 'en-GB', label: 'English (UK) · 1,234.5' },
  { tag: 'de-DE', label: 'Deutsch · 1.234,5' },
  { tag: 'fr-FR', label: 'Français · 1 234,5' },
  { tag: 'es-ES', label: 'Español · 1234,5' },
  { tag: 'pt-BR', label: 'Português (BR) · 1.234,5' },
  { tag: 'en-IN', label: 'English (India) · 1,234.5' },
];

export interface DisplayPrefs {
  units: UnitSystem;
  /** BCP 47 tag, or '' for the browser's language (navigator.language). */
  locale: string;
  theme: ThemeChoice;
}

export const PREFS_KEY = 'joulepath.display.v1';

export const DEFAULT_PREFS: DisplayPrefs = { units: 'si', locale: '', theme: 'auto' };

/** A locale tag Intl accepts, or undefined. */
export function validLocale(tag: unknown): string | undefined {
  if (typeof tag !== 'string' || tag === '') return undefined;
  // Asking Intl is slow next to formatting a number, and every figure asks: remember the answer.
  const known = checkedLocales.get(tag);
  if (known !== undefined) return known ? tag : undefined;
  let ok: boolean;
  try {
    ok = Intl.NumberFormat.supportedLocalesOf([tag]).length > 0;
  } catch {
    ok = false;
  }
  checkedLocales.set(tag, ok);
  return ok ? tag : undefined;
}
const checkedLocales = new Map<string, boolean>();

/** Reads stored preferences; anything missing or malformed falls back to the default. */
export function parsePrefs(text: string | null | undefined): DisplayPrefs {
  if (!text) return { ...DEFAULT_PREFS };
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch {
    return { ...DEFAULT_PREFS };
  }
  const o = typeof raw === 'object' && raw !== null ? (raw as Record<string, unknown>) : {};
  return {
    units: UNIT_SYSTEMS.includes(o.units as UnitSystem) ? (o.units as UnitSystem) : DEFAULT_PREFS.units,
    locale: validLocale(o.locale) ?? DEFAULT_PREFS.locale,
    theme: THEME_CHOICES.includes(o.theme as ThemeChoice) ? (o.theme as ThemeChoice) : DEFAULT_PREFS.theme,
  };
}

/** What this module uses of the browser (typed here so it also type-checks under Node for tests). */
interface StorageLike {
  getItem(key: string): string | null;
  setItem(key: string, value: string): void;
}
interface MediaQueryLike {
  matches: boolean;
  addEventListener?(type: 'change', listener: (event: { matches: boolean }) => void): void;
}
const host = globalThis as {
  localStorage?: StorageLike;
  navigator?: { language?: string };
  matchMedia?: (query: string) => MediaQueryLike;
  document?: { documentElement: { dataset: Record<string, string | undefined> } };
};

/** The storage object, or undefined when there is none or touching it throws. */
function storage(): StorageLike | undefined {
  try {
    return host.localStorage ?? undefined;
  } catch {
    return undefined;
  }
}

function loadPrefs(): DisplayPrefs {
  try {
    return parsePrefs(storage()?.getItem(PREFS_KEY));
  } catch {
    return { ...DEFAULT_PREFS };
  }
}

const initial = loadPrefs();

export const unitSystem = signal<UnitSystem>(initial.units);
/** The chosen locale tag; '' follows the browser. */
export const localeChoice = signal<string>(initial.locale);
export const themeChoice = signal<ThemeChoice>(initial.theme);

/** The locale numbers are formatted in: the choice, else navigator.language, else the runtime's. */
export function effectiveLocale(choice: string = localeChoice.value): string | undefined {
  return validLocale(choice) ?? validLocale(host.navigator?.language) ?? undefined;
}

/** Writes the preferences; returns false when storage is missing or refuses (never throws). */
export function savePrefs(prefs: DisplayPrefs, store: Pick<StorageLike, 'setItem'> | undefined = storage()): boolean {
  if (!store) return false;
  try {
    store.setItem(PREFS_KEY, JSON.stringify(prefs));
    return true;
  } catch {
    return false;
  }
}

/** The device's colour-scheme preference, followed while the theme choice is 'auto'. */
const darkQuery = host.matchMedia?.('(prefers-color-scheme: dark)');
export const deviceDark = signal<boolean>(darkQuery?.matches ?? false);
darkQuery?.addEventListener?.('change', (event) => (deviceDark.value = event.matches));

/** The theme in force: the choice, or the device's preference for 'auto'. */
export function resolveTheme(choice: ThemeChoice, dark: boolean): 'light' | 'dark' {
  return choice === 'auto' ? (dark ? 'dark' : 'light') : choice;
}

// Store every change, and put the theme in force on <html data-theme> for the stylesheet.
effect(() => {
  const prefs: DisplayPrefs = { units: unitSystem.value, locale: localeChoice.value, theme: themeChoice.value };
  savePrefs(prefs);
  const root = host.document?.documentElement;
  if (root) root.dataset.theme = resolveTheme(prefs.theme, deviceDark.value);
});

// ---------- running-cost settings (what the losses cost per year; machines panel) ----------
// The energy price and hours a year now live in the project file (`running`, core/model/study-settings.ts).
// What was the person's preference (a price per kWh in their own currency, the hours a year their
// chains run, kept on this device) is what a project without `running` starts from: an older file, a
// new project. The last value typed in a project becomes it, so the next new project starts there.
// Kept under a key of its own so the display record stays as is.

export interface CostPrefs {
  /** Price of energy per kWh in the locale's currency; null until the user gives one. */
  pricePerKWh: number | null;
  /** Hours per year at the solved operating point (8760 = all year). */
  hoursPerYear: number;
}

export const COST_KEY = 'joulepath.cost.v1';
export const DEFAULT_COST_PREFS: CostPrefs = { pricePerKWh: null, hoursPerYear: 8760 };

/** Reads stored cost settings; anything missing, malformed or out of range falls back to the default. */
export function parseCostPrefs(text: string | null | undefined): CostPrefs {
  let raw: unknown;
  try {
    raw = text ? JSON.parse(text) : {};
  } catch {
    raw = {};
  }
  const o = typeof raw === 'object' && raw !== null ? (raw as Record<string, unknown>) : {};
  const price = o.pricePerKWh;
  const hours = o.hoursPerYear;
  return {
    pricePerKWh: typeof price === 'number' && Number.isFinite(price) && price >= 0 ? price : DEFAULT_COST_PREFS.pricePerKWh,
    hoursPerYear: typeof hours === 'number' && Number.isFinite(hours) && hours >= 0 && hours <= 8784 ? hours : DEFAULT_COST_PREFS.hoursPerYear,
  };
}

const initialCost = (() => {
  try {
    return parseCostPrefs(storage()?.getItem(COST_KEY));
  } catch {
    return { ...DEFAULT_COST_PREFS };
  }
})();

export const energyPrice = signal<number | null>(initialCost.pricePerKWh);
export const operatingHours = signal<number>(initialCost.hoursPerYear);

effect(() => {
  const prefs: CostPrefs = { pricePerKWh: energyPrice.value, hoursPerYear: operatingHours.value };
  const store = storage();
  try {
    store?.setItem(COST_KEY, JSON.stringify(prefs));
  } catch {
    // Storage refused (private mode, full): the values stay in memory for this visit.
  }
});

/** Hours in a common year (365 × 24): a project's `running` without hours runs all year (core/studies/economics.ts). */
const ALL_YEAR_H = 8760;

/** The running cost a project works with, and whether it comes from this device (the project has no `running` yet). */
export interface RunningInForce {
  /** Price per kWh; null: none given, no cost. */
  price: number | null;
  hours: number;
  fromDevice: boolean;
}

const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/**
 * The energy price and hours a project works with: its own `running` settings (hours 8760 when left
 * out, as the engine and the command line read them), or, for a project without them (an older file,
 * a new project), the setting kept on this device.
 */
export function runningInForce(project: unknown, device: CostPrefs = { pricePerKWh: energyPrice.value, hoursPerYear: operatingHours.value }): RunningInForce {
  const running = isRecord(project) ? project['running'] : undefined;
  if (!isRecord(running)) return { price: device.pricePerKWh, hours: device.hoursPerYear, fromDevice: true };
  const price = running['energyPricePerKWh'];
  const hours = running['hoursPerYear'];
  return { price: typeof price === 'number' ? price : null, hours: typeof hours === 'number' ? hours : ALL_YEAR_H, fromDevice: false };
}

/**
 * The cost settings the studies take ({ pricePerKWh, hoursPerYear }, and the project's day/night tariff
 * when it gives a night price: the losses worked out over the load profile pay each stretch at its
 * hours' price), or null without a price.
 */
export function costInForce(project: unknown): { pricePerKWh: number; hoursPerYear: number; tariff?: DayNightTariff } | null {
  const r = runningInForce(project);
  if (r.price === null) return null;
  // A night price in the file makes the losses' price the day's mean, as the engine and the CLI take it
  // (core/studies/tariff.ts, costSettingsOf); the price field itself shows the day price as given.
  const running = isRecord(project) && isRecord(project['running']) ? project['running'] : {};
  const num = (k: string) => (typeof running[k] === 'number' ? (running[k] as number) : undefined);
  if (r.fromDevice) return { pricePerKWh: r.price, hoursPerYear: r.hours };
  const t = tariffOfRunning({ energyPricePerKWh: r.price, nightPricePerKWh: num('nightPricePerKWh'), dayStartHour: num('dayStartHour'), dayEndHour: num('dayEndHour') });
  const tariff = dayNightTariff(t);
  return { pricePerKWh: meanPrice(t).pricePerKWh, hoursPerYear: r.hours, ...(tariff ? { tariff } : {}) };
}
