// Numbers as people type them into forms: by the marks of their locale ("2,050" is two
// thousand and fifty in en-US, "2.050" in de-DE, "2 050" in fr-FR). Text that two common
// conventions would read as two different numbers is refused with both readings, never
// guessed. Forms only: fleet files and the command line keep plain JSON numbers.

/** The marks a locale writes numbers with, as Intl.NumberFormat prints them. */
export interface NumberMarks {
  readonly locale: string;
  /** "." or "," (any other mark is read as one of these two). */
  readonly decimal: string;
  /** ",", ".", a space or an apostrophe ("'"); spaces and apostrophes are normalised. */
  readonly group: string;
  /** Groups of two above the first thousand (12,34,567), as in en-IN. */
  readonly indianGrouping: boolean;
}

/** Locales a user can choose for numbers; '' follows the system's. */
export const NUMBER_LOCALE_TAGS = ['', 'en-US', 'en-GB', 'en-IN', 'de-DE', 'de-CH', 'fr-FR', 'es-ES', 'it-IT', 'nl-NL', 'pt-BR', 'sv-SE', 'pl-PL'] as const;

export type ParsedNumber = { kind: 'empty' } | { kind: 'number'; value: number } | { kind: 'refused'; message: string };

const SPACES = /[\s\u00a0\u2007\u2009\u202f]/gu;
const APOSTROPHES = /['\u2019\u02bc\u2032]/gu;
const MINUS = /^[-\u2212\u2012\u2013]/u;

function normaliseGroup(mark: string): string {
  if (mark.replace(SPACES, '') === '') return ' ';
  if (mark.replace(APOSTROPHES, '') === '') return "'";
  return mark;
}

const marksCache = new Map<string, NumberMarks>();

/** Reads the decimal and group marks of a locale from Intl's own formatting (Latin digits). */
export function numberMarks(locale: string): NumberMarks {
  const cached = marksCache.get(locale);
  if (cached) return cached;
  let format: Intl.NumberFormat;
  try {
    format = new Intl.NumberFormat(locale, { numberingSystem: 'latn', useGrouping: true });
  } catch {
    format = new Intl.NumberFormat('en-US');
  }
  const parts = format.formatToParts(1234567.5);
  const decimal = parts.find((p) => p.type === 'decimal')?.value ?? '.';
  const group = normaliseGroup(parts.find((p) => p.type === 'group')?.value ?? (decimal === ',' ? '.' : ','));
  const integers = parts.filter((p) => p.type === 'integer').map((p) => p.value);
  const marks: NumberMarks = {
    locale: format.resolvedOptions().locale,
    decimal: decimal === ',' || decimal === '.' ? decimal : decimal === '\u066b' ? '.' : '.',
    group,
    indianGrouping: integers.length === 3 && integers[0] === '12' && integers[1] === '34',
  };
  marksCache.set(locale, marks);
  return marks;
}

const plain = (n: number): string => String(n);

/** A number in the locale's marks, without thousands marks. */
function local(n: number, marks: NumberMarks): string {
  return new Intl.NumberFormat(marks.locale, { numberingSystem: 'latn', useGrouping: false, maximumFractionDigits: 20 }).format(n);
}

/** Groups split by group marks: the first 1–3 digits (1–2 for Indian), the rest 3 (Indian: 2, then 3 last). */
function validGroups(groups: readonly string[], indian: boolean): boolean {
  if (groups.length < 2) return false;
  const [first, ...rest] = groups;
  if (!first || !/^\d{1,3}$/u.test(first) || (first.length > 1 && first.startsWith('0')) || first === '0') return false;
  const western = rest.every((g) => /^\d{3}$/u.test(g));
  if (western) return true;
  if (!indian) return false;
  const last = rest[rest.length - 1];
  return /^\d{1,2}$/u.test(first) && last !== undefined && /^\d{3}$/u.test(last) && rest.slice(0, -1).every((g) => /^\d{2}$/u.test(g));
}

const markName = (m: string): string => (m === ' ' ? 'a space' : m === "'" ? 'an apostrophe' : `“${m}”`);

/**
 * Parses what a user typed into a number field. `marks` come from `numberMarks(locale)`.
 * Refusals say how the text was read and what to type instead.
 */
export function parseNumberText(input: string, marks: NumberMarks): ParsedNumber {
  let text = input.trim();
  if (text === '') return { kind: 'empty' };
  if (/^[-+]?0[xob]/iu.test(text)) return { kind: 'refused', message: `“${text}” is not a decimal number: type the value in plain digits` };
  if (/\d\s*e\s*[-+]?\d/iu.test(text)) return { kind: 'refused', message: `“${text}” uses an exponent: type the digits out (for example 1000000, not 1e6)` };
  let sign = 1;
  if (MINUS.test(text)) {
    sign = -1;
    text = text.slice(1).trimStart();
  } else if (text.startsWith('+')) text = text.slice(1).trimStart();
  // Spaces and apostrophes only ever group digits; every kind of space reads the same.
  const body = text.replace(SPACES, ' ').replace(APOSTROPHES, "'");
  if (!/^[\d.,' ]+$/u.test(body) || !/\d/u.test(body)) return { kind: 'refused', message: `“${input.trim()}” is not a number` };
  const value = (digits: string): ParsedNumber => ({ kind: 'number', value: sign * Number(digits) || 0 });
  const marksUsed = [...body].filter((c) => !/\d/u.test(c));
  const kinds = [...new Set(marksUsed)];

  if (kinds.length === 0) return value(body);

  const localDecimal = marks.decimal;
  const both = (mark: string, asDecimal: number, asGroup: number) =>
    `“${input.trim()}” is ambiguous: with ${markName(mark)} as the decimal mark it reads ${local(sign * asDecimal, marks)}, as a thousands mark ${local(sign * asGroup, marks)}. Type ${local(sign * asDecimal, marks)} or ${local(sign * asGroup, marks)}`;

  // One kind of mark.
  if (kinds.length === 1) {
    const mark = kinds[0]!;
    const groups = body.split(mark);
    if (mark === ' ' || mark === "'") {
      if (validGroups(groups, marks.indianGrouping)) return value(groups.join(''));
      return { kind: 'refused', message: `“${input.trim()}”: ${markName(mark)} may only separate groups of three digits (as in 2 050)` };
    }
    if (groups.length > 2) {
      // Several of one mark can only be thousands marks.
      if (mark === localDecimal) return { kind: 'refused', message: `“${input.trim()}” has more than one decimal mark ${markName(mark)}` };
      if (validGroups(groups, marks.indianGrouping)) return value(groups.join(''));
      return { kind: 'refused', message: `“${input.trim()}”: thousands marks ${markName(mark)} must separate groups of three digits` };
    }
    const [whole = '', fraction = ''] = groups;
    const decimalReading = `${whole === '' ? '0' : whole}.${fraction}`;
    if (fraction === '') {
      if (whole === '') return { kind: 'refused', message: `“${input.trim()}” is not a number` };
      return value(whole);
    }
    const couldGroup = validGroups(groups, marks.indianGrouping);
    if (!couldGroup) return value(decimalReading); // "2,5" or "0.050": only a decimal reading exists
    if (mark === marks.group) return value(groups.join(''));
    // The printed specs of the trade group thousands with ",": in a decimal-comma locale
    // "2,050" may be a copied Kv of two thousand and fifty.
    if (mark === localDecimal && mark === '.') return value(decimalReading);
    return { kind: 'refused', message: both(mark, Number(decimalReading), Number(groups.join(''))) };
  }

  // Two kinds of mark: the last one is the decimal mark, every earlier one a thousands mark.
  const decimalMark = marksUsed[marksUsed.length - 1]!;
  const groupMarks = kinds.filter((k) => k !== decimalMark);
  if (groupMarks.length !== 1 || marksUsed.filter((m) => m === decimalMark).length !== 1) {
    return { kind: 'refused', message: `“${input.trim()}” mixes marks in a way that does not read as one number` };
  }
  const groupMark = groupMarks[0]!;
  const cut = body.lastIndexOf(decimalMark);
  const intPart = body.slice(0, cut);
  const fraction = body.slice(cut + 1);
  const groups = intPart.split(groupMark);
  const shapeOk = (decimalMark === '.' || decimalMark === ',') && /^\d*$/u.test(fraction) && validGroups(groups, marks.indianGrouping);
  const localGroupOk = groupMark === marks.group || groupMark === ' ' || groupMark === "'";
  if (shapeOk && decimalMark === localDecimal && localGroupOk) return value(`${groups.join('')}.${fraction}`);
  const example = new Intl.NumberFormat(marks.locale, { numberingSystem: 'latn', maximumFractionDigits: 20 }).format(1234.5);
  if (shapeOk) {
    return {
      kind: 'refused',
      message: `“${input.trim()}” uses ${markName(groupMark)} for thousands and ${markName(decimalMark)} for decimals, but numbers here are written ${example}: if you mean ${plain(sign * Number(`${groups.join('')}.${fraction}`))}, type ${local(sign * Number(`${groups.join('')}.${fraction}`), marks)}`,
    };
  }
  return { kind: 'refused', message: `“${input.trim()}” mixes marks in a way that does not read as one number (numbers here are written ${example})` };
}

/**
 * A value written for an input box in the locale's marks, without thousands marks, and so
 * that it parses back to itself: a comma-decimal locale's "1,125" would read as ambiguous,
 * so it is written "1,1250".
 */
export function numberForInput(value: number, marks: NumberMarks): string {
  const text = String(value);
  if (!/^-?\d+(\.\d+)?$/u.test(text)) return local(value, marks);
  const [whole = '', fraction] = text.replace('-', '').split('.');
  let out = fraction === undefined ? whole : `${whole}${marks.decimal}${fraction}`;
  if (fraction !== undefined && fraction.length === 3 && marks.decimal !== '.' && validGroups([whole, fraction], marks.indianGrouping)) out += '0';
  return value < 0 ? `-${out}` : out;
}
