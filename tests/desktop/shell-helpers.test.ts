import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { dbPathFromArgv } from '../../src-main/desktop/command-line';
import { contentTypeFor } from '../../src-main/shell-common/content-type';
import { menuTemplate } from '../../src-main/desktop/menu';
import { pdfFileName } from '../../src-main/desktop/pdf-file-name';
import { defaultDataDir } from '../../src-main/store/data-location';

describe('dbPathFromArgv', () => {
  const env = { XDG_CONFIG_HOME: '/home/ana/.config' };

  it('prefers --db PATH and --db=PATH over the environment', () => {
    expect(dbPathFromArgv(['/usr/bin/electron', 'dist-main/desktop-main.cjs', '--db', '/tmp/a.sqlite'], { ...env, RIGBOOK_DB: '/tmp/b.sqlite' })).toEqual({ ok: true, dbPath: '/tmp/a.sqlite' });
    expect(dbPathFromArgv(['Rigbook', '--db=/tmp/c.sqlite'], env)).toEqual({ ok: true, dbPath: '/tmp/c.sqlite' });
  });

  it('falls back to RIGBOOK_DB, then the shared data folder', () => {
    expect(dbPathFromArgv(['Rigbook'], { ...env, RIGBOOK_DB: '/tmp/b.sqlite' })).toEqual({ ok: true, dbPath: '/tmp/b.sqlite' });
    expect(dbPathFromArgv(['Rigbook', '--no-sandbox-is-not-ours'], env)).toEqual({ ok: true, dbPath: join(defaultDataDir(env), 'rigbook.sqlite') });
  });

  it.each([[['Rigbook', '--db']], [['Rigbook', '--db', '--inspect']], [['Rigbook', '--db=']]])('names the field when --db has no path: %j', (argv) => {
    const choice = dbPathFromArgv(argv, env);
    expect(choice.ok).toBe(false);
    if (!choice.ok) expect(choice.message).toMatch(/^db: /);
  });
});

describe('pdfFileName', () => {
  it('keeps a readable name and adds the extension once', () => {
    expect(pdfFileName('Truck 3 – build sheet')).toBe('Truck 3 – build sheet.pdf');
    expect(pdfFileName('quad-5in.PDF')).toBe('quad-5in.pdf');
  });

  it('treats path characters as text, never as folders', () => {
    expect(pdfFileName('../../etc/passwd')).toBe('etc-passwd.pdf');
    expect(pdfFileName('C:\\Windows\\x')).toBe('C-Windows-x.pdf');
    expect(pdfFileName('a\u0000b\nc')).toBe('a-b-c.pdf');
  });

  it('falls back when nothing usable is left, and caps the length', () => {
    expect(pdfFileName(undefined)).toBe('build-sheet.pdf');
    expect(pdfFileName(' ... ')).toBe('build-sheet.pdf');
    expect(pdfFileName('x'.repeat(500))).toBe(`${'x'.repeat(100)}.pdf`);
  });
});

describe('contentTypeFor', () => {
  // Types per the IANA media type registry and RFC 9239 (text/javascript) — from memory.
  it.each([
    ['index.html', 'text/html; charset=utf-8'],
    ['assets/app-1a2b.js', 'text/javascript; charset=utf-8'],
    ['assets/app.CSS', 'text/css; charset=utf-8'],
    ['assets/logo.svg', 'image/svg+xml'],
    ['assets/font.woff2', 'font/woff2'],
    ['assets/unknown.bin', 'application/octet-stream'],
    ['README', 'application/octet-stream'],
  ])('%s → %s', (file, type) => {
    expect(contentTypeFor(file)).toBe(type);
  });
});

describe('menuTemplate', () => {
  const labels = (platform: NodeJS.Platform) =>
    menuTemplate({ backUp: () => {}, importFleet: () => {}, exportFleet: () => {}, about: () => {} }, platform).map((item) => ({
      label: item.label ?? item.role,
      items: Array.isArray(item.submenu) ? item.submenu.map((sub) => sub.label ?? sub.type ?? sub.role) : [],
    }));

  it('is the plain File / View / Help menu', () => {
    expect(labels('linux')).toEqual([
      { label: 'File', items: ['Import fleet file…', 'Export fleet file…', 'separator', 'Back up…', 'separator', 'Quit'] },
      { label: 'View', items: ['Reload', 'Toggle full screen'] },
      { label: 'Help', items: ['About Rigbook'] },
    ]);
  });

  it('adds the app and Edit menus macOS needs', () => {
    expect(labels('darwin').map((m) => m.label)).toEqual(['appMenu', 'File', 'editMenu', 'View', 'Help']);
  });

  it('wires the fleet files, Back up… and About to the actions', () => {
    const hits: string[] = [];
    const template = menuTemplate({ backUp: () => hits.push('backUp'), importFleet: () => hits.push('importFleet'), exportFleet: () => hits.push('exportFleet'), about: () => hits.push('about') }, 'linux');
    const find = (label: string) => template.flatMap((m) => (Array.isArray(m.submenu) ? m.submenu : [])).find((i) => i.label === label);
    // click's real arguments are Electron objects that these handlers ignore.
    (find('Import fleet file…')?.click as (() => void) | undefined)?.();
    (find('Export fleet file…')?.click as (() => void) | undefined)?.();
    (find('Back up…')?.click as (() => void) | undefined)?.();
    (find('About Rigbook')?.click as (() => void) | undefined)?.();
    expect(hits).toEqual(['importFleet', 'exportFleet', 'backUp', 'about']);
  });
});
