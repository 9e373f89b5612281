// Results tables as CSV (web/format/csv.ts). Quoting: RFC 4180 §2 rules 5–7. Formula prefix: OWASP
// "CSV Injection" advice. Unit factors: SI prefixes (SI Brochure, 9th ed., Table 7); the shown figures
// come from the page's own formatters (web/format/number.ts, units.ts), so what is read back is what
// a user saw.
import { describe, expect, it } from 'vitest';
import { csvField, csvFileName, csvNumber, layGrid, readFigure, tableCsv, toCsv } from '../../web/format/csv.ts';
import { formatCurrent, formatPercent, formatPower, formatVoltage } from '../../web/format/number.ts';
import { formatLength, formatTemperature } from '../../web/format/units.ts';

const cells = (...texts: string[]) => texts.map((text) => ({ text }));

describe('csvField (RFC 4180 §2)', () => {
  it('leaves plain text alone', () => expect(csvField('Inverter 1')).toBe('Inverter 1'));
  it('quotes a comma, a quote, CR and LF, doubling quotes (rules 6, 7)', () => {
    expect(csvField('Hut, north')).toBe('"Hut, north"');
    expect(csvField('12" rack')).toBe('"12"" rack"');
    expect(csvField('line 1\nline 2')).toBe('"line 1\nline 2"');
    expect(csvField('a\r\nb')).toBe('"a\r\nb"');
  });
  it('keeps text that starts a formula from running (OWASP), but not numbers', () => {
    expect(csvField('=SUM(A1)')).toBe("'=SUM(A1)");
    expect(csvField('@x')).toBe("'@x");
    expect(csvField('-3', true)).toBe('-3');
    expect(csvField('-3')).toBe("'-3");
  });
  it('ends every record with CRLF (rule 1)', () => {
    expect(toCsv([cells('a', 'b,c'), [{ text: '1', numeric: true }, { text: '' }]])).toBe('a,"b,c"\r\n1,\r\n');
  });
});

describe('readFigure', () => {
  it.each([
    // [shown text, locale, value, unit]
    [formatPower(1234, 'en-US'), 'en-US', 1234, 'W'],
    [formatPower(1234, 'de-DE'), 'de-DE', 1234, 'W'],
    [formatPower(1_250_000, 'fr-FR'), 'fr-FR', 1_250_000, 'W'],
    [formatPower(850, 'en-US'), 'en-US', 850, 'W'],
    [formatVoltage(230, 'en-US'), 'en-US', 230, 'V'],
    [formatCurrent(-12.5, 'en-US'), 'en-US', -12.5, 'A'],
    [formatPercent(0.0345, 'en-US', 3), 'en-US', 3.45, '%'],
    [formatPercent(0.0345, 'de-DE', 3), 'de-DE', 3.45, '%'],
    [formatLength(30.48, 'us', 'en-US'), 'en-US', 100, 'ft'],
    [formatTemperature(90, 'us', 'en-US'), 'en-US', 194, '°F'],
    ['2.5 mm²', 'en-US', 2.5, 'mm²'],
    ['12 mΩ', 'en-US', 0.012, 'Ω'],
    ['1,234.5', 'en-US', 1234.5, ''],
  ] as const)('%j (%s) → %d %s', (text, locale, value, unit) => {
    expect(readFigure(text, locale)).toEqual({ value, unit });
  });
  it('is not fooled by text, sizes or several figures', () => {
    for (const t of ['Inverter', '4 AWG', '4/0 AWG', '0.98 lagging', '500 W (5 W idle)', '1.5 kW · 2 hp', '—']) expect(readFigure(t, 'en-US'), t).toBeNull();
    // de-DE reads "1.5" neither as 1.5 nor 15 (web/format/parse.ts).
    expect(readFigure('1.5 kW', 'de-DE')).toBeNull();
  });
});

describe('csvNumber', () => {
  it('writes dot decimals, no grouping, 15 significant digits', () => {
    expect(csvNumber(1234.5)).toBe('1234.5');
    expect(csvNumber(1.234 * 1000)).toBe('1234');
    expect(csvNumber(0.1 + 0.2)).toBe('0.3');
    expect(csvNumber(-0)).toBe('0');
  });
});

describe('tableCsv', () => {
  it('makes numeric columns of one unit, with the unit in the header, and keeps text columns as text', () => {
    const head = [cells('Element', 'Power', 'Drop', 'Size')];
    const body = [
      cells('Battery, 48 V', formatPower(1234, 'de-DE'), formatPercent(0.021, 'de-DE', 3), '4 AWG'),
      cells('Fridge "A"', formatPower(850, 'de-DE'), '—', '2.5 mm²'),
    ];
    expect(tableCsv(head, body, 'de-DE')).toBe('Element,Power (W),Drop (%),Size\r\n"Battery, 48 V",1234,2.1,4 AWG\r\n"Fridge ""A""",850,,2.5 mm²\r\n');
  });
  it('a column mixing units stays text', () => {
    expect(tableCsv([cells('x')], [cells('1 V'), cells('2 A')], 'en-US')).toBe('x\r\n1 V\r\n2 A\r\n');
  });
  it('US units: feet and °F in the header when the page shows them', () => {
    const csv = tableCsv([cells('Cable', 'Length', 'Conductor temperature')], [cells('Run', formatLength(30.48, 'us', 'en-US'), formatTemperature(75, 'us', 'en-US'))], 'en-US');
    expect(csv).toBe('Cable,Length (ft),Conductor temperature (°F)\r\nRun,100,167\r\n');
  });
  it('repeats a cell spanning rows in each (the port table names an element once for its two ports)', () => {
    expect(layGrid([[{ text: 'Inv', rowSpan: 2 }, { text: 'in' }], [{ text: 'out' }]])).toEqual([['Inv', 'in'], ['Inv', 'out']]);
    expect(layGrid([[{ text: 'A', colSpan: 2 }, { text: 'B' }], cells('1', '2', '3')])).toEqual([['A', 'A', 'B'], ['1', '2', '3']]);
    // Two header rows: a group heading over its columns.
    const csv = tableCsv([[{ text: 'Element', rowSpan: 2 }, { text: 'Input', colSpan: 2 }], cells('V', 'I')], [cells('Inv', '48 V', '10 A')], 'en-US');
    expect(csv).toBe('Element,Input V (V),Input I (A)\r\nInv,48,10\r\n');
  });
});

describe('csvFileName', () => {
  it('joins the project and the table, letters and digits kept', () => {
    expect(csvFileName('Hillside relay hut', 'Power at each element')).toBe('hillside-relay-hut-power-at-each-element.csv');
    expect(csvFileName('Kühlhaus / Nord', 'Cables')).toBe('kühlhaus-nord-cables.csv');
    expect(csvFileName('', '')).toBe('project-table.csv');
  });
});
