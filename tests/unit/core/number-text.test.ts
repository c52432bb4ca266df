import { describe, expect, it } from 'vitest';
import { numberForInput, numberMarks, parseNumberText, type ParsedNumber } from '../../../src-main/core/number-text';

// The outside reference is Intl.NumberFormat itself (ECMA-402, with the CLDR data of the
// running engine): whatever it prints for a locale must read back as the same number, or be
// refused as ambiguous, never read as a different number.

const LOCALES = ['en-US', 'de-DE', 'fr-FR', 'en-IN', 'de-CH', 'en-GB', 'es-ES', 'sv-SE', 'pt-BR'] as const;

const read = (text: string, locale: string): ParsedNumber => parseNumberText(text, numberMarks(locale));
const num = (text: string, locale: string): number | null => {
  const r = read(text, locale);
  return r.kind === 'number' ? r.value : null;
};
const refusal = (text: string, locale: string): string => {
  const r = read(text, locale);
  if (r.kind !== 'refused') throw new Error(`expected “${text}” (${locale}) to be refused, got ${JSON.stringify(r)}`);
  return r.message;
};

/** A deterministic spread of values with 0–4 decimals and 1–9 integer digits. */
function samples(): number[] {
  const out: number[] = [0, 1, 7, 10, 999, 1000, 2050, 12345.6, 1234567.891, 0.5, 0.014, 3.175, 110, 4.33, 99999.99, 100000, 2.85, 0.9];
  let seed = 20261202;
  const next = () => (seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
  for (let i = 0; i < 400; i++) {
    const digits = Math.floor(next() * 9);
    const decimals = Math.floor(next() * 5);
    out.push(Number((next() * 10 ** digits).toFixed(decimals)));
  }
  return out;
}

/** d,ddd / d.ddd with the locale's decimal mark: the one printed shape a form refuses. */
const ambiguousShape = (text: string, decimal: string) => decimal === ',' && /^[-\u2212]?[1-9]\d{0,2},\d{3}$/u.test(text);

describe('numbers typed by locale, against Intl.NumberFormat as the reference', () => {
  for (const locale of LOCALES) {
    it(`${locale}: what Intl prints reads back as the same number (or is refused as ambiguous, never misread)`, () => {
      const marks = numberMarks(locale);
      const grouped = new Intl.NumberFormat(locale, { maximumFractionDigits: 4 });
      const ungrouped = new Intl.NumberFormat(locale, { maximumFractionDigits: 4, useGrouping: false });
      let checked = 0;
      for (const x of samples()) {
        for (const value of [x, -x]) {
          for (const f of [grouped, ungrouped]) {
            const text = f.format(value);
            const r = read(text, locale);
            if (ambiguousShape(text, marks.decimal)) {
              expect(r.kind, `${locale} “${text}”`).toBe('refused');
            } else {
              expect(r, `${locale} “${text}”`).toEqual({ kind: 'number', value: Number(value.toFixed(4)) || 0 });
              checked++;
            }
          }
        }
      }
      expect(checked).toBeGreaterThan(1000);
    });

    it(`${locale}: the form's own text for a value always reads back as that value`, () => {
      const marks = numberMarks(locale);
      for (const x of [...samples(), 1.125, 2.05, 0.0021, 123.456]) {
        const text = numberForInput(x, marks);
        expect(read(text, locale), `${locale} “${text}”`).toEqual({ kind: 'number', value: x });
      }
    });
  }

  it('reads the marks each locale prints (Intl formatToParts)', () => {
    expect(numberMarks('en-US')).toMatchObject({ decimal: '.', group: ',', indianGrouping: false });
    expect(numberMarks('de-DE')).toMatchObject({ decimal: ',', group: '.' });
    // fr-FR groups with a narrow no-break space (U+202F), read as a space.
    expect(numberMarks('fr-FR')).toMatchObject({ decimal: ',', group: ' ' });
    expect(numberMarks('de-CH')).toMatchObject({ decimal: '.', group: "'" });
    expect(numberMarks('en-IN')).toMatchObject({ decimal: '.', group: ',', indianGrouping: true });
  });
});

describe('typed by hand', () => {
  it('reads 2,050 as two thousand and fifty where "," groups thousands', () => {
    expect(num('2,050', 'en-US')).toBe(2050);
    expect(num('2,050', 'en-IN')).toBe(2050);
    expect(num('20,50,000', 'en-IN')).toBe(2050000);
    expect(num('1,234.5', 'en-US')).toBe(1234.5);
    expect(num('2.050', 'de-DE')).toBe(2050);
    expect(num('1.234,5', 'de-DE')).toBe(1234.5);
  });

  it('reads 2 050 (any kind of space) as two thousand and fifty', () => {
    expect(num('2 050', 'fr-FR')).toBe(2050);
    expect(num('2\u202f050', 'fr-FR')).toBe(2050);
    expect(num('2\u00a0050,5', 'fr-FR')).toBe(2050.5);
    expect(num('2 050', 'en-US')).toBe(2050);
    expect(num("2'050", 'de-CH')).toBe(2050);
    expect(num('2\u2019050.5', 'de-CH')).toBe(2050.5);
  });

  it('refuses 2,050 where "," is the decimal mark, showing both readings', () => {
    expect(refusal('2,050', 'de-DE')).toBe('“2,050” is ambiguous: with “,” as the decimal mark it reads 2,05, as a thousands mark 2050. Type 2,05 or 2050');
    expect(refusal('2,050', 'fr-FR')).toContain('2,05');
    // In de-CH "," is neither mark: both readings are shown.
    expect(refusal('2,050', 'de-CH')).toContain('2.05');
    expect(refusal('2.050', 'fr-FR')).toContain('2050');
  });

  it('refuses marks mixed against the locale, saying how the number would read', () => {
    expect(refusal('1.234,5', 'en-US')).toBe('“1.234,5” uses “.” for thousands and “,” for decimals, but numbers here are written 1,234.5: if you mean 1234.5, type 1234.5');
    expect(refusal('1,234.5', 'de-DE')).toContain('type 1234,5');
    expect(refusal('1,2.3,4', 'en-US')).toContain('does not read as one number');
    expect(refusal('1.234.567', 'en-US')).toContain('more than one decimal mark');
  });

  it('reads a lone decimal mark that cannot be a thousands mark as decimals', () => {
    expect(num('2,05', 'de-DE')).toBe(2.05);
    expect(num('0,050', 'de-DE')).toBe(0.05);
    expect(num('2.5', 'de-DE')).toBe(2.5);
    expect(num('2.050', 'en-US')).toBe(2.05);
    expect(num('.5', 'en-US')).toBe(0.5);
    expect(num('-3.25', 'en-US')).toBe(-3.25);
    expect(num('−3,25', 'fr-FR')).toBe(-3.25);
  });

  it('refuses hexadecimal, exponents, words and stray marks', () => {
    expect(refusal('0x10', 'en-US')).toContain('not a decimal number');
    expect(refusal('1e9', 'en-US')).toContain('exponent');
    expect(refusal('2.5E-3', 'en-US')).toContain('exponent');
    expect(refusal('Infinity', 'en-US')).toContain('not a number');
    expect(refusal('lots', 'en-US')).toContain('not a number');
    expect(refusal('2 05', 'fr-FR')).toContain('groups of three');
    expect(refusal('.', 'en-US')).toContain('not a number');
    expect(read('   ', 'en-US')).toEqual({ kind: 'empty' });
  });
});
