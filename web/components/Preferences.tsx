/** The header's display settings: unit system, number format (locale) and colour theme. */
import { LOCALE_CHOICES, THEME_CHOICES, localeChoice, themeChoice, unitSystem, type ThemeChoice } from '../state/prefs.ts';
import type { UnitSystem } from '../format/units.ts';

const UNIT_LABELS: Record<UnitSystem, string> = {
  si: 'SI (m, mm², °C)',
  us: 'US (ft, AWG, °F, hp)',
};

const THEME_LABELS: Record<ThemeChoice, string> = {
  auto: 'As the device',
  light: 'Light',
  dark: 'Dark',
};

export function Preferences() {
  const browserLanguage = globalThis.navigator?.language;
  return (
    <form class="prefs" aria-label="Display settings" onSubmit={(e) => e.preventDefault()}>
      <label class="prefs__field">
        <span class="prefs__label">Units</span>
        <select
          data-testid="units-select"
          value={unitSystem.value}
          onChange={(e) => (unitSystem.value = e.currentTarget.value as UnitSystem)}
        >
          {(Object.keys(UNIT_LABELS) as UnitSystem[]).map((u) => (
            <option key={u} value={u}>
              {UNIT_LABELS[u]}
            </option>
          ))}
        </select>
      </label>
      <label class="prefs__field prefs__field--wide">
        <span class="prefs__label">Numbers</span>
        <select data-testid="locale-select" value={localeChoice.value} onChange={(e) => (localeChoice.value = e.currentTarget.value)}>
          <option value="">As the browser{browserLanguage ? ` (${browserLanguage})` : ''}</option>
          {LOCALE_CHOICES.map((l) => (
            <option key={l.tag} value={l.tag}>
              {l.label}
            </option>
          ))}
          {localeChoice.value !== '' && !LOCALE_CHOICES.some((l) => l.tag === localeChoice.value) && (
            <option value={localeChoice.value}>{localeChoice.value}</option>
          )}
        </select>
      </label>
      <label class="prefs__field">
        <span class="prefs__label">Theme</span>
        <select data-testid="theme-select" value={themeChoice.value} onChange={(e) => (themeChoice.value = e.currentTarget.value as ThemeChoice)}>
          {THEME_CHOICES.map((t) => (
            <option key={t} value={t}>
              {THEME_LABELS[t]}
            </option>
          ))}
        </select>
      </label>
    </form>
  );
}
