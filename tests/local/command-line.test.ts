import { describe, expect, it } from 'vitest';
import { parseLocalArgs } from '../../src-main/local/command-line';

describe("the browser shell's command line", () => {
  it('reads --db and --port in both spellings, and RIGBOOK_PORT', () => {
    expect(parseLocalArgs(['--db', './a.sqlite', '--port', '8123'], {})).toEqual({ kind: 'serve', db: './a.sqlite', port: 8123 });
    expect(parseLocalArgs(['--db=./a.sqlite', '--port=0'], {})).toEqual({ kind: 'serve', db: './a.sqlite', port: 0 });
    expect(parseLocalArgs([], { RIGBOOK_PORT: '9000' })).toEqual({ kind: 'serve', db: undefined, port: 9000 });
    expect(parseLocalArgs(['--help'], {})).toEqual({ kind: 'help' });
    expect(parseLocalArgs(['-h', '--db', 'x'], {})).toEqual({ kind: 'help' });
  });

  it.each([
    [['--dbb', 'x.sqlite'], "Unknown option '--dbb'"],
    [['--verbose'], "Unknown option '--verbose'"],
    [['-x'], "Unknown option '-x'"],
    [['fleet.sqlite'], 'unexpected argument "fleet.sqlite" (the store is given with --db PATH)'],
    [['--db'], "Option '--db <value>' argument missing"],
    [['--db', ''], '--db needs a file path, e.g. --db ./fleet.sqlite'],
    [['--port', '70000'], '--port: "70000" is not a port number (0 to 65535)'],
    [['--port', 'http'], '--port: "http" is not a port number (0 to 65535)'],
    [['--host', '0.0.0.0'], 'there is no --host option: the browser shell listens on 127.0.0.1 only (this computer)'],
  ])('refuses %j instead of starting on the default store', (args, message) => {
    expect(parseLocalArgs(args, {})).toEqual({ kind: 'refused', message });
  });

  it('refuses a RIGBOOK_PORT that is not a port', () => {
    expect(parseLocalArgs([], { RIGBOOK_PORT: 'abc' })).toEqual({ kind: 'refused', message: 'RIGBOOK_PORT: "abc" is not a port number (0 to 65535)' });
  });
});
