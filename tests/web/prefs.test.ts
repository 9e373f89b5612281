// Display preferences (web/state/prefs.ts): stored choices are read back, bad stored data falls
// back to the defaults, and a storage that refuses to write never throws. Behaviour, not values
// from a source: common practice (no source).
import { describe, expect, it } from 'vitest';
import { DEFAULT_PREFS, PREFS_KEY, parsePrefs, resolveTheme, savePrefs, validLocale } from '../../web/state/prefs.ts';

describe('reading stored preferences', () => {
  it('reads a valid record', () => {
    expect(parsePrefs(JSON.stringify({ units: 'us', locale: 'de-DE', theme: 'dark' }))).toEqual({
      units: 'us',
      locale: 'de-DE',
      theme: 'dark',
    });
  });

  it('falls back per field on missing, malformed or unknown values', () => {
    expect(parsePrefs(null)).toEqual(DEFAULT_PREFS);
    expect(parsePrefs('{not json')).toEqual(DEFAULT_PREFS);
    expect(parsePrefs('"si"')).toEqual(DEFAULT_PREFS);
    expect(parsePrefs(JSON.stringify({ units: 'imperial', locale: 42, theme: 'sepia' }))).toEqual(DEFAULT_PREFS);
    expect(parsePrefs(JSON.stringify({ units: 'us', locale: 'not a locale!!' }))).toEqual({ ...DEFAULT_PREFS, units: 'us' });
  });

  it('accepts only locale tags that Intl accepts', () => {
    expect(validLocale('fr-FR')).toBe('fr-FR');
    expect(validLocale('')).toBeUndefined();
    expect(validLocale('x_y_z!')).toBeUndefined();
  });
});

describe('writing preferences', () => {
  it('writes JSON under its key', () => {
    const written = new Map<string, string>();
    expect(savePrefs({ units: 'us', locale: '', theme: 'auto' }, { setItem: (k, v) => void written.set(k, v) })).toBe(true);
    expect(parsePrefs(written.get(PREFS_KEY))).toEqual({ units: 'us', locale: '', theme: 'auto' });
  });

  it('reports a refused write instead of throwing (quota, private mode, no storage)', () => {
    const refusing = {
      setItem: () => {
        throw new Error('QuotaExceededError');
      },
    };
    expect(savePrefs(DEFAULT_PREFS, refusing)).toBe(false);
    expect(savePrefs(DEFAULT_PREFS, undefined)).toBe(false);
  });
});

describe('the theme in force', () => {
  it('follows the device for "auto" and the choice otherwise', () => {
    expect(resolveTheme('auto', true)).toBe('dark');
    expect(resolveTheme('auto', false)).toBe('light');
    expect(resolveTheme('light', true)).toBe('light');
    expect(resolveTheme('dark', false)).toBe('dark');
  });
});
