import { readFileSync, symlinkSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { openServiceHost } from '../../src-main/service/open-service-host';
import { demoFleet } from '../../demo-fixtures/demo-fleet';
import { tempDir } from '../helpers/temp-dir';

// The build sheet's PDF is written where the shell's save dialog says. The dialog is the OS's
// (replaced here by one that answers a chosen path); the store must never be the file written.

const chosen = vi.hoisted(() => ({ path: '' }));
vi.mock('electron', () => ({
  app: { getPath: () => '/documents' },
  BrowserWindow: { fromWebContents: () => null },
  dialog: { showSaveDialog: async () => ({ canceled: false, filePath: chosen.path }) },
}));

const { printToPdf } = await import('../../src-main/desktop/print-to-pdf');

const temps: (() => void)[] = [];
afterEach(() => {
  for (const remove of temps.splice(0)) remove();
});

describe('desktop.printToPdf destination', () => {
  it('refuses a file that is the store through a linked folder, writes nothing, and writes an ordinary file', async () => {
    const t = tempDir('rigbook-pdf-');
    temps.push(t.remove);
    const store = t.file('rigbook.sqlite');
    const host = await openServiceHost({ dbPath: store, actor: 'tester', demoFleet });
    await host.call('demo.load', {});
    await host.close();
    const before = readFileSync(store);
    symlinkSync(t.dir, t.file('alias'));
    let printed = 0;
    const sender = { printToPDF: async () => (printed++, Buffer.from('%PDF-1.7 sheet')) } as unknown as import('electron').WebContents;

    chosen.path = join(t.dir, 'alias', 'rigbook.sqlite');
    const refused = await printToPdf({ sender, storePath: store }, { suggestedName: 'Truck' });
    expect(refused).toMatchObject({ ok: false, error: { kind: 'invalid', message: expect.stringMatching(/is the store itself/) } });
    expect(printed).toBe(0);
    expect(readFileSync(store).equals(before)).toBe(true);

    chosen.path = t.file('truck.pdf');
    expect(await printToPdf({ sender, storePath: store }, {})).toEqual({ ok: true, value: { saved: true, path: chosen.path } });
    expect(readFileSync(chosen.path, 'utf8')).toBe('%PDF-1.7 sheet');
  });
});
