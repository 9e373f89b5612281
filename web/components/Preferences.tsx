/**
 * The display settings (unit system, number format (locale), colour theme), in a small settings menu
 * opened from the header: a button that shows and hides the panel (a disclosure: aria-expanded,
 * aria-controls), Escape or "Done" closes it and gives the focus back to the button, a tap outside
 * closes it too.
 */
import { useSignal } from '@preact/signals';
import { useLayoutEffect, useRef } from 'preact/hooks';
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

/** The header's settings button and its panel. */
export function SettingsMenu() {
  const open = useSignal(false);
  const button = useRef<HTMLButtonElement>(null);
  const panel = useRef<HTMLDivElement>(null);
  const close = (refocus: boolean) => {
    open.value = false;
    if (refocus) button.current?.focus();
  };
  useLayoutEffect(() => {
    if (!open.value) return;
    // Into the panel at its first setting, before the browser paints (a key pressed as soon as the panel
    // shows reaches it); a tap or click outside closes it (the focus stays where it lands).
    panel.current?.querySelector<HTMLElement>('select')?.focus();
    const onDown = (ev: PointerEvent) => {
      const t = ev.target as Node | null;
      if (t && !panel.current?.contains(t) && !button.current?.contains(t)) open.value = false;
    };
    document.addEventListener('pointerdown', onDown);
    return () => document.removeEventListener('pointerdown', onDown);
  }, [open.value]);
  return (
    <div class="settings">
      <button
        type="button"
        class="masthead__button"
        ref={button}
        aria-expanded={open.value}
        aria-controls="settings-panel"
        data-testid="settings-button"
        onClick={() => (open.value = !open.value)}
      >
        <svg class="masthead__icon" viewBox="0 0 20 20" width="20" height="20" aria-hidden="true" focusable="false">
          <path d="M3 5h14M3 10h14M3 15h14M7 3v4M13 8v4M9 13v4" fill="none" stroke="currentColor" stroke-width="1.8" stroke-linecap="round" />
        </svg>
        <span>Settings</span>
      </button>
      <div
        id="settings-panel"
        class="settings__panel"
        ref={panel}
        role="group"
        aria-labelledby="settings-heading"
        hidden={!open.value}
        data-testid="settings-panel"
        onKeyDown={(ev) => {
          if (ev.key === 'Escape') {
            ev.preventDefault();
            close(true);
          }
        }}
      >
        <p id="settings-heading" class="settings__heading">Display settings</p>
        <Preferences />
        <p class="settings__note">Only how figures are shown changes; nothing is recomputed.</p>
        <button type="button" class="store-btn settings__done" onClick={() => close(true)}>
          Done
        </button>
      </div>
    </div>
  );
}
