import { describe, expect, it } from 'vitest';
import { TextWidth, type MeasureText } from '../../src-renderer/lib/format/text-width';

// A stand-in for the canvas: every character has a fixed, fractional advance, and kerned pairs
// ("AV") draw narrower together than apart, as real fonts do. The browser test
// (builds-cell-fit.e2e.ts) checks the bound against Chromium's own layout of the list.
const ADVANCE: Record<string, number> = { '1': 5.2, '8': 6.9, A: 7.6, V: 7.6, W: 11.3, i: 2.9, ' ': 3.4, '·': 3.9 };
function fakeCanvas(): { measure: MeasureText; calls: string[] } {
  const calls: string[] = [];
  const measure: MeasureText = (font, text) => {
    calls.push(`${font}|${text}`);
    const scale = font.startsWith('600') ? 1.1 : 1;
    let width = 0;
    for (const ch of text) width += (ADVANCE[ch] ?? (/\d/.test(ch) ? 6 : 8.5)) * scale;
    return text.includes('AV') ? width - 1.5 : width;
  };
  return { measure, calls };
}

/** What the stand-in draws a whole run as: the sum of advances, less the kerning. */
function drawn(text: string, font = '400 13px x'): number {
  return fakeCanvas().measure(font, text);
}

describe('TextWidth.upperBound', () => {
  it('is at least the drawn width, for narrow, wide, kerned and unlisted characters', () => {
    const width = new TextWidth(fakeCanvas().measure);
    for (const text of ['Build 1181', 'WWWWWW', 'iiiiiiiiii', 'AVAV', 'cont. · pack', '测试 🚗', '']) {
      expect(width.upperBound(text, '400 13px x')).toBeGreaterThanOrEqual(drawn(text));
      expect(width.upperBound(text, '600 13px x')).toBeGreaterThanOrEqual(drawn(text, '600 13px x'));
    }
  });

  it('counts every digit as the widest digit, as tabular figures draw them', () => {
    const width = new TextWidth(fakeCanvas().measure);
    // "1" draws 5.2 px, "8" 6.9 px: with tabular figures both take the widest digit's place.
    expect(width.upperBound('1111', '400 13px x')).toBe(width.upperBound('8888', '400 13px x'));
    expect(width.upperBound('1111', '400 13px x')).toBeGreaterThanOrEqual(4 * 6.9);
  });

  it('rounds each advance up to a whole pixel and adds a pixel a character and two for the line', () => {
    const width = new TextWidth(fakeCanvas().measure);
    // "W" 11.3 → 12, "i" 2.9 → 3: (12 + 1) + (3 + 1) + 2.
    expect(width.upperBound('Wi', '400 13px x')).toBe(19);
    expect(width.upperBound('', '400 13px x')).toBe(0);
    // Letter spacing is added after every character.
    expect(width.upperBound('Wi', '400 13px x', 0.5)).toBe(20);
  });

  it('measures each character once per font, however often it is asked', () => {
    const canvas = fakeCanvas();
    const width = new TextWidth(canvas.measure);
    width.upperBound('Build 12', '400 13px x');
    const first = canvas.calls.length;
    width.upperBound('Build 21 Build', '400 13px x');
    expect(canvas.calls.length).toBe(first);
    width.upperBound('Build', '600 13px x');
    expect(canvas.calls.length).toBeGreaterThan(first);
  });
});
