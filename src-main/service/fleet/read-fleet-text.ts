/** A file's text as JSON, or the reason it is not JSON, with the line and column where reading stopped. */
export type JsonRead = { ok: true; value: unknown } | { ok: false; reason: string };

function lineAndColumn(text: string, position: number): { line: number; column: number } {
  let line = 1;
  let lineStart = 0;
  for (let i = 0; i < position && i < text.length; i++) {
    if (text.charCodeAt(i) === 10) {
      line++;
      lineStart = i + 1;
    }
  }
  return { line, column: position - lineStart + 1 };
}

class SyntaxStop {
  constructor(
    readonly at: number,
    readonly what: string,
  ) {}
}

/**
 * Walks the text the way JSON's grammar reads it, only to say where it first goes wrong:
 * the runtime's own messages differ between versions and often leave the place out.
 */
function firstSyntaxError(text: string): SyntaxStop | null {
  let i = 0;
  const end = (): never => {
    throw new SyntaxStop(text.length, 'end');
  };
  const fail = (expected: string): never => {
    if (i >= text.length) end();
    throw new SyntaxStop(i, `unexpected ${JSON.stringify(text[i])} where ${expected} should be`);
  };
  const space = () => {
    while (i < text.length && ' \t\r\n'.includes(text[i]!)) i++;
  };
  const literal = (word: string) => {
    for (const c of word) {
      if (i >= text.length) end();
      if (text[i] !== c) fail(`"${word}"`);
      i++;
    }
  };
  const string = () => {
    i++;
    for (;;) {
      if (i >= text.length) end();
      const c = text[i]!;
      if (c === '"') {
        i++;
        return;
      }
      if (c === '\\') {
        i++;
        if (i >= text.length) end();
        if (text[i] === 'u') {
          if (!/^[0-9a-fA-F]{4}$/.test(text.slice(i + 1, i + 5))) fail('four hex digits');
          i += 5;
        } else if ('"\\/bfnrt'.includes(text[i]!)) i++;
        else fail('an escape such as \\n or \\"');
      } else if (c.charCodeAt(0) < 0x20) fail('text (a line break inside a string must be written \\n)');
      else i++;
    }
  };
  const number = () => {
    const m = /^-?(0|[1-9]\d*)(\.\d+)?([eE][+-]?\d+)?/.exec(text.slice(i, i + 400));
    if (!m || m[0] === '' || m[0] === '-') fail('a number');
    i += m![0].length;
  };
  const value = (): void => {
    space();
    if (i >= text.length) end();
    const c = text[i]!;
    if (c === '{') {
      i++;
      space();
      if (text[i] === '}') {
        i++;
        return;
      }
      for (;;) {
        space();
        if (text[i] !== '"') fail('a field name in double quotes');
        string();
        space();
        if (text[i] !== ':') fail('":"');
        i++;
        value();
        space();
        if (text[i] === ',') {
          i++;
          continue;
        }
        if (text[i] === '}') {
          i++;
          return;
        }
        fail('"," or "}"');
      }
    }
    if (c === '[') {
      i++;
      space();
      if (text[i] === ']') {
        i++;
        return;
      }
      for (;;) {
        value();
        space();
        if (text[i] === ',') {
          i++;
          continue;
        }
        if (text[i] === ']') {
          i++;
          return;
        }
        fail('"," or "]"');
      }
    }
    if (c === '"') return string();
    if (c === 't') return literal('true');
    if (c === 'f') return literal('false');
    if (c === 'n') return literal('null');
    if (c === '-' || (c >= '0' && c <= '9')) return number();
    fail('a value');
  };
  try {
    value();
    space();
    if (i < text.length) fail('the end of the file');
    return null;
  } catch (stop) {
    if (stop instanceof SyntaxStop) return stop;
    throw stop;
  }
}

export function readJsonText(text: string): JsonRead {
  // A byte-order mark is how some editors start a UTF-8 file; it is not part of the JSON.
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  if (body.trim() === '') return { ok: false, reason: 'The file is empty.' };
  try {
    return { ok: true, value: JSON.parse(body) as unknown };
  } catch (error) {
    const stop = firstSyntaxError(body);
    if (stop === null) return { ok: false, reason: `The file is not JSON: ${error instanceof Error ? error.message : String(error)}.` };
    if (stop.what === 'end') return { ok: false, reason: 'The file is not complete JSON: it ends in the middle of a value (was it cut off while copying?).' };
    const { line, column } = lineAndColumn(body, stop.at);
    return { ok: false, reason: `The file is not JSON: ${stop.what}, at line ${line}, column ${column}.` };
  }
}
