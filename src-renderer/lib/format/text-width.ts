// An upper bound on how wide a line of text is drawn, from each character's own advance, so a
// list cell can tell whether its text could overflow without laying it out. A cell that cannot
// overflow is not clipped, and a clipped cell costs the browser a clip of its own on every
// keystroke that rewrites the list (measured in docs/performance.md).
//
// The bound is the sum of the characters' advances, each rounded up to whole pixels (screens
// may snap glyph advances to pixels at small sizes), every digit as wide as the widest digit
// (tabular figures), plus a pixel per character and two more for kerning and shaping: kerning
// mostly narrows a pair, and the pixel a character covers the rare pair it widens. Each
// character is measured alone, once per font.

/** Measures one run of text in a CSS font shorthand, in CSS pixels (a canvas, in the page). */
export type MeasureText = (font: string, text: string) => number;

const DIGITS = '0123456789';
/** Per character: one pixel of slack, and two for the line. */
const SLACK_PER_CHAR = 1;
const SLACK = 2;

export class TextWidth {
  readonly #measure: MeasureText;
  /** Advance per character, per font. */
  readonly #fonts = new Map<string, Map<string, number>>();

  constructor(measure: MeasureText) {
    this.#measure = measure;
  }

  #advances(font: string): Map<string, number> {
    let table = this.#fonts.get(font);
    if (table) return table;
    table = new Map();
    let widestDigit = 0;
    for (const d of DIGITS) widestDigit = Math.max(widestDigit, this.#measure(font, d));
    for (const d of DIGITS) table.set(d, Math.ceil(widestDigit));
    this.#fonts.set(font, table);
    return table;
  }

  /** At least the drawn width of `text` in `font` with `letterSpacing` px between characters. */
  upperBound(text: string, font: string, letterSpacing = 0): number {
    if (text === '') return 0;
    const table = this.#advances(font);
    let width = SLACK;
    for (const ch of text) {
      let advance = table.get(ch);
      if (advance === undefined) {
        advance = Math.ceil(this.#measure(font, ch));
        table.set(ch, advance);
      }
      width += advance + SLACK_PER_CHAR + letterSpacing;
    }
    return width;
  }
}

/** A measurer drawing on a canvas of its own; null where there is no canvas (tests, a worker). */
export function canvasMeasure(): MeasureText | null {
  if (typeof document === 'undefined') return null;
  const context = document.createElement('canvas').getContext('2d');
  if (!context) return null;
  // The canvas rewrites the font it is given, so the last one set is remembered here.
  let current = '';
  return (font, text) => {
    if (current !== font) context.font = current = font;
    return context.measureText(text).width;
  };
}
