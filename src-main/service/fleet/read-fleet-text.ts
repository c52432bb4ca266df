import { placeOf } from './fleet-problems';

/**
 * A file's text as JSON, or why it is not usable: `unreadable` when it is not JSON at all
 * (with the line and column where reading stopped), or a field named twice in one object
 * (readable, but refused: JSON.parse would silently keep the last one).
 */
export type JsonRead = { ok: true; value: unknown } | { ok: false; unreadable: boolean; place: string; reason: string };

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

export type ScanStop = { kind: 'syntax'; at: number; what: string } | { kind: 'end' } | { kind: 'duplicate'; place: string; key: string; at: number };

/** A string with no escape and no control character: nearly every string of a fleet file. */
const PLAIN_STRING = /"[^"\\\u0000-\u001f]*"/y;
const NUMBER = /-?(?:0|[1-9]\d*)(?:\.\d+)?(?:[eE][+-]?\d+)?/y;

class Stop {
  constructor(readonly stop: ScanStop) {}
}

type Frame = { object: true; keys: Set<string>; key: string } | { object: false; index: number };

function framePath(stack: readonly Frame[]): (string | number)[] {
  return stack.map((f) => (f.object ? f.key : f.index));
}

/**
 * Walks the text the way JSON's grammar reads it, with an explicit stack rather than
 * recursion (a file nested 20 000 deep must get an answer, not overflow the call stack), to
 * say where it first goes wrong and to find a field named twice in one object. The runtime's
 * own messages differ between versions and often leave the place out.
 */
export function scanJson(text: string): ScanStop | null {
  let i = 0;
  const n = text.length;
  const stack: Frame[] = [];
  // A field named twice is remembered and the walk goes on: a file that is also broken further
  // down must be reported as unreadable (as JSON.parse would), not as a mere repeated name.
  let duplicate: ScanStop | null = null;
  const end = (): never => {
    throw new Stop({ kind: 'end' });
  };
  const fail = (expected: string): never => {
    if (i >= n) end();
    throw new Stop({ kind: 'syntax', at: i, what: `unexpected ${JSON.stringify(text[i])} where ${expected} should be` });
  };
  const space = () => {
    for (;;) {
      const c = text.charCodeAt(i);
      if (c === 32 || c === 9 || c === 10 || c === 13) i++;
      else return;
    }
  };
  /** Reads a string from its opening quote; returns whether it held an escape. */
  const string = (): boolean => {
    // The common case in one sticky regular expression; the loop below reads escapes and finds the place of a fault.
    PLAIN_STRING.lastIndex = i;
    if (PLAIN_STRING.test(text)) {
      i = PLAIN_STRING.lastIndex;
      return false;
    }
    i++;
    let escaped = false;
    for (;;) {
      if (i >= n) end();
      const c = text.charCodeAt(i);
      if (c === 34) {
        i++;
        return escaped;
      }
      if (c === 92) {
        escaped = true;
        i++;
        if (i >= n) end();
        if (text[i] === 'u') {
          if (!/^[0-9a-fA-F]{4}$/.test(text.slice(i + 1, i + 5))) fail('four hex digits');
          i += 5;
        } else if ('"\\/bfnrt'.includes(text[i]!)) i++;
        else fail('an escape such as \\n or \\"');
      } else if (c < 0x20) fail('text (a line break inside a string must be written \\n)');
      else i++;
    }
  };
  const literal = (word: string) => {
    for (const c of word) {
      if (i >= n) end();
      if (text[i] !== c) fail(`"${word}"`);
      i++;
    }
  };
  const number = () => {
    NUMBER.lastIndex = i;
    const m = NUMBER.exec(text);
    if (!m) fail('a number');
    i += m![0].length;
  };
  /** A field name and its colon, inside the object on top of the stack. */
  const key = () => {
    space();
    if (text[i] !== '"') fail('a field name in double quotes');
    const start = i;
    const escaped = string();
    const name = escaped ? (JSON.parse(text.slice(start, i)) as string) : text.slice(start + 1, i - 1);
    const frame = stack[stack.length - 1] as Frame & { object: true };
    if (frame.keys.has(name) && duplicate === null) {
      frame.key = name;
      duplicate = { kind: 'duplicate', place: placeOf('', ...framePath(stack)), key: name, at: start };
    }
    frame.keys.add(name);
    frame.key = name;
    space();
    if (text[i] !== ':') fail('":"');
    i++;
  };
  try {
    // Alternates between reading one value and what may follow it inside its container.
    for (;;) {
      space();
      if (i >= n) end();
      const c = text[i]!;
      let opened = false;
      if (c === '{') {
        i++;
        space();
        if (text[i] === '}') i++;
        else {
          stack.push({ object: true, keys: new Set(), key: '' });
          key();
          opened = true;
        }
      } else if (c === '[') {
        i++;
        space();
        if (text[i] === ']') i++;
        else {
          stack.push({ object: false, index: 0 });
          opened = true;
        }
      } else if (c === '"') string();
      else if (c === 't') literal('true');
      else if (c === 'f') literal('false');
      else if (c === 'n') literal('null');
      else if (c === '-' || (c >= '0' && c <= '9')) number();
      else fail('a value');
      if (opened) continue;
      // A value is complete: close every container it completes.
      for (;;) {
        space();
        const top = stack[stack.length - 1];
        if (top === undefined) {
          if (i < n) fail('the end of the file');
          return duplicate;
        }
        if (text[i] === ',') {
          i++;
          if (top.object) key();
          else top.index++;
          break;
        }
        if (text[i] === (top.object ? '}' : ']')) {
          i++;
          stack.pop();
          continue;
        }
        fail(top.object ? '"," or "}"' : '"," or "]"');
      }
    }
  } catch (stop) {
    if (stop instanceof Stop) return stop.stop;
    throw stop;
  }
}

export function readJsonText(text: string): JsonRead {
  // A byte-order mark is how some editors start a UTF-8 file; it is not part of the JSON.
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  if (body.trim() === '') return { ok: false, unreadable: true, place: '', reason: 'The file is empty.' };
  let value: unknown;
  let parseError: unknown = null;
  try {
    value = JSON.parse(body) as unknown;
  } catch (error) {
    parseError = error;
  }
  // Run on every file, not only broken ones: JSON.parse keeps the last of two equal field names without a word.
  const stop = scanJson(body);
  if (stop === null) {
    if (parseError === null) return { ok: true, value };
    return { ok: false, unreadable: true, place: '', reason: `The file is not JSON: ${parseError instanceof Error ? parseError.message : String(parseError)}.` };
  }
  if (stop.kind === 'end') return { ok: false, unreadable: true, place: '', reason: 'The file is not complete JSON: it ends in the middle of a value (was it cut off while copying?).' };
  const { line, column } = lineAndColumn(body, stop.at);
  if (stop.kind === 'duplicate') {
    return {
      ok: false,
      unreadable: false,
      place: stop.place,
      reason: `the field "${stop.key}" appears twice in one object (the second at line ${line}, column ${column}); only one may be given, so nothing is silently dropped`,
    };
  }
  return { ok: false, unreadable: true, place: '', reason: `The file is not JSON: ${stop.what}, at line ${line}, column ${column}.` };
}
