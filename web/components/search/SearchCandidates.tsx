/**
 * The candidates of "Find the option" (SearchPanel.tsx): the boxes the user ticks — the system voltage
 * (12 / 24 / 48 V, when the chain has a DC system bank with its cells), strings in the bank (1–4), the
 * inverters (the editor's template at typical efficiencies with a typical idle draw, each editable; the
 * inverter as it is, with its own loss model, always tried) and each sized cable's sizes (the cable's own
 * table) — with a price for each, written into the panel's `optionSearch` settings.
 */
import { type CableStage, type Element, type OptionSearch, type Solved } from '../../../core/page.ts';
import { listedSizes, SYSTEM_VOLTAGES, systemBank } from '../../../core/studies/index.ts';
import type { DraftElement } from '../../state/editor.ts';
import { inverterPreset, inverterRating, presetIdleLoss, PRESET_EFFICIENCIES } from './inverter-presets.ts';
import { formatPercent, formatSignificant, formatWithPrefix } from '../../format/number.ts';
import { NumberInput, type Locale } from './SearchNumberInput.tsx';

const STRINGS = [1, 2, 3, 4] as const;

const nameOf = (e: { id: string; name?: string }) => e.name ?? e.id;

/** The inverter's own loss model in words ("its efficiency curve and an idle draw of 25 W"). */
function ownLossWords(inv: Element, locale: Locale): string {
  const loss = (inv as { loss?: { model: string; efficiency?: number; idleLoss?: number; p0?: number } }).loss;
  if (!loss) return 'its own losses';
  const idle = loss.idleLoss !== undefined ? ` and an idle draw of ${formatSignificant(loss.idleLoss, 3, locale)} W` : ' and no idle draw';
  switch (loss.model) {
    case 'constant':
      return `its constant efficiency of ${formatPercent(loss.efficiency ?? 1, locale, 3)}${idle}`;
    case 'curve':
      return `its efficiency curve${idle}`;
    case 'polynomial':
      return `its loss polynomial (no-load loss ${formatSignificant(loss.p0 ?? 0, 3, locale)} W)`;
    default:
      return 'its efficiency points (a fitted loss polynomial)';
  }
}

export function Candidates({ solved, settings, update, locale }: { solved: Solved; settings: OptionSearch; update: (s: OptionSearch) => void; locale: Locale }) {
  const project = solved.project;
  const bank = project.elements.find((e) => e.kind === 'battery' && e.bank !== undefined);
  const cables = project.elements.filter((e): e is CableStage => e.kind === 'cable' && e.conductor !== undefined);
  const inverters = project.elements.filter((e) => e.kind === 'inverter');
  const counts = settings.strings?.counts ?? [];
  // The system voltage changes the DC system's bank (its cells in series): offered only when the chain has one with its cells.
  const dcBank = systemBank(project);
  const volts = settings.systemVoltages ?? [];
  const toggleVolts = (v: number, on: boolean) => {
    const next = on ? [...volts, v].sort((a, b) => a - b) : volts.filter((x) => x !== v);
    update({ ...settings, systemVoltages: next });
  };
  const toggleCount = (n: number, on: boolean) => {
    const next = on ? [...counts, n].sort((a, b) => a - b) : counts.filter((x) => x !== n);
    update({ ...settings, strings: { ...(settings.strings ?? {}), bank: bank!.id, counts: next } });
  };
  const cableSettings = (id: string) => settings.cables?.find((c) => c.cable === id);
  const setCable = (id: string, change: (c: NonNullable<OptionSearch['cables']>[number]) => NonNullable<OptionSearch['cables']>[number]) => {
    const list = settings.cables ?? [];
    const current = list.find((c) => c.cable === id) ?? { cable: id, sizes: [] };
    const next = change(current);
    update({ ...settings, cables: [...list.filter((c) => c.cable !== id), next] });
  };
  const invSettings = (id: string) => settings.inverters?.find((i) => i.element === id);
  const setInv = (id: string, change: (i: NonNullable<OptionSearch['inverters']>[number]) => NonNullable<OptionSearch['inverters']>[number]) => {
    const list = settings.inverters ?? [];
    const current = list.find((i) => i.element === id) ?? { element: id, alternatives: [] };
    update({ ...settings, inverters: [...list.filter((i) => i.element !== id), change(current)] });
  };
  return (
    <div class="search-candidates" data-testid="search-candidates">
      {dcBank?.bank && (
        <fieldset class="search-axis" data-testid="search-voltages">
          <legend>System voltage of {nameOf(dcBank)}</legend>
          <div class="search-ticks">
            {SYSTEM_VOLTAGES.map((v) => (
              <label key={v} class="search-tick">
                <input type="checkbox" checked={volts.includes(v)} data-testid={`search-volts-${v}`} onChange={(e) => toggleVolts(v, (e.currentTarget as HTMLInputElement).checked)} />
                {v} V
              </label>
            ))}
          </div>
          <p class="note">The bank is re-strung for each voltage (the same cells where they divide) and the other candidates are tried at it; the strings count at that voltage.</p>
        </fieldset>
      )}
      {bank && (
        <fieldset class="search-axis">
          <legend>Strings in {nameOf(bank)}</legend>
          <div class="search-ticks">
            {STRINGS.map((n) => (
              <label key={n} class="search-tick">
                <input type="checkbox" checked={counts.includes(n)} data-testid={`search-strings-${n}`} onChange={(e) => toggleCount(n, (e.currentTarget as HTMLInputElement).checked)} />
                {n} {n === 1 ? 'string' : 'strings'}
              </label>
            ))}
          </div>
          <NumberInput
            id="search-string-price"
            label="Price of one string"
            unit=""
            value={settings.strings?.pricePerString}
            locale={locale}
            testId="search-string-price"
            help={bank.price !== undefined ? 'Empty: the bank’s purchase price shared over its strings.' : 'Without it the strings count as unpriced.'}
            onValue={(v) => {
              const { pricePerString: _p, ...rest } = settings.strings ?? { bank: bank.id, counts: [] };
              update({ ...settings, strings: { ...rest, bank: bank.id, counts: rest.counts ?? [], ...(v !== undefined ? { pricePerString: v } : {}) } });
            }}
          />
        </fieldset>
      )}
      {inverters.map((inv) => {
        const s = invSettings(inv.id);
        const draft = inv as unknown as DraftElement;
        const rated = inverterRating(draft);
        const typicalIdle = presetIdleLoss(draft);
        const setAlt = (id: string, change: (a: Element) => Element) => setInv(inv.id, (i) => ({ ...i, alternatives: i.alternatives.map((a) => (a.id === id ? change(a) : a)) }));
        return (
          <fieldset class="search-axis" key={inv.id}>
            <legend>Inverters in place of {nameOf(inv)}</legend>
            <p class="note" data-testid={`search-inverter-own-${inv.id}`}>Always tried: {nameOf(inv)} as it is, with {ownLossWords(inv, locale)}.</p>
            <p class="note">
              Each inverter below has a constant efficiency and an idle draw of {typicalIdle !== undefined ? `${formatSignificant(typicalIdle, 3, locale)} W` : 'none'}
              {rated !== undefined ? ` (about 1 % of the ${formatWithPrefix(rated, 'W', 3, locale)} rating)` : ''}: typical values: use the maker’s figure for each efficiency, idle draw and price.
            </p>
            {PRESET_EFFICIENCIES.map((eff) => {
              const preset = inverterPreset(draft, eff);
              const chosen = s?.alternatives.find((a) => a.id === preset.id);
              const pct = Math.round(eff * 100);
              const chosenIdle = chosen ? ((chosen as unknown as { loss?: { idleLoss?: number } }).loss?.idleLoss) : undefined;
              return (
                <div class="search-choice" key={eff}>
                  <label class="search-tick">
                    <input
                      type="checkbox"
                      checked={chosen !== undefined}
                      data-testid={`search-inverter-${inv.id}-${pct}`}
                      onChange={(e) => {
                        const on = (e.currentTarget as HTMLInputElement).checked;
                        setInv(inv.id, (i) => ({ ...i, alternatives: on ? [...i.alternatives, preset as unknown as Element] : i.alternatives.filter((a) => a.id !== preset.id) }));
                      }}
                    />
                    {preset.name}
                  </label>
                  {chosen && (
                    <>
                      <NumberInput
                        id={`search-price-${preset.id}`}
                        label={`Price of ${preset.name}`}
                        unit=""
                        value={chosen.price}
                        locale={locale}
                        testId={`search-inverter-price-${inv.id}-${pct}`}
                        onValue={(v) =>
                          setAlt(preset.id, (a) => {
                            const { price: _p, ...rest } = a;
                            return (v !== undefined ? { ...rest, price: v } : rest) as Element;
                          })
                        }
                      />
                      <NumberInput
                        id={`search-idle-${preset.id}`}
                        label={`Idle draw of ${preset.name}`}
                        unit="W"
                        value={chosenIdle}
                        locale={locale}
                        help="Drawn with no output (no-load loss). Typical value: use the maker’s figure. Empty: none."
                        testId={`search-inverter-idle-${inv.id}-${pct}`}
                        onValue={(v) =>
                          setAlt(preset.id, (a) => {
                            const { idleLoss: _i, ...loss } = (a as unknown as { loss: Record<string, unknown> }).loss;
                            return { ...a, loss: v !== undefined ? { ...loss, idleLoss: v } : loss } as unknown as Element;
                          })
                        }
                      />
                    </>
                  )}
                </div>
              );
            })}
          </fieldset>
        );
      })}
      {cables.map((cable) => {
        const s = cableSettings(cable.id);
        const sizes = s?.sizes ?? [];
        const priceOf = (size: string) => s?.prices?.find((p) => p.size === size)?.price;
        return (
          <fieldset class="search-axis" key={cable.id}>
            <legend>Sizes of {nameOf(cable)}</legend>
            <div class="search-ticks">
              {listedSizes(cable).map((size) => (
                <label key={size} class="search-tick">
                  <input
                    type="checkbox"
                    checked={sizes.includes(size)}
                    data-testid={`search-size-${cable.id}-${size}`}
                    onChange={(e) => {
                      const on = (e.currentTarget as HTMLInputElement).checked;
                      const listed = listedSizes(cable);
                      setCable(cable.id, (c) => ({ ...c, sizes: listed.filter((x) => (x === size ? on : (c.sizes ?? []).includes(x))) }));
                    }}
                  />
                  {size}
                </label>
              ))}
            </div>
            {sizes.map((size) => (
              <NumberInput
                key={size}
                id={`search-price-${cable.id}-${size}`}
                label={`Price of ${nameOf(cable)} at ${size}`}
                unit=""
                value={priceOf(size)}
                locale={locale}
                testId={`search-size-price-${cable.id}-${size}`}
                onValue={(v) =>
                  setCable(cable.id, (c) => ({
                    ...c,
                    prices: [...(c.prices ?? []).filter((p) => p.size !== size), ...(v !== undefined ? [{ size, price: v }] : [])],
                  }))
                }
              />
            ))}
          </fieldset>
        );
      })}
    </div>
  );
}

