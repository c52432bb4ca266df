import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { anchorsIn, brokenLinks, docFiles, linksIn, slugOf } from './doc-links';

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');

describe('links in the docs', () => {
  it('every relative link in README, DEVELOPERS and docs/ leads to a file and a heading that exist', () => {
    const files = docFiles(ROOT);
    expect(files).toEqual(expect.arrayContaining(['README.md', 'DEVELOPERS.md', 'docs/testing.md']));
    expect(files.flatMap((file) => brokenLinks(ROOT, file))).toEqual([]);
  });

  // The anchors as a rendered page makes them (GitHub's heading ids: lower case, punctuation
  // other than hyphens and underscores dropped, each space a hyphen; from memory).
  it('makes anchors from headings as a rendered page does', () => {
    expect(slugOf('How to add a field')).toBe('how-to-add-a-field');
    expect(slugOf('Numbers, percent fields and units in the forms')).toBe('numbers-percent-fields-and-units-in-the-forms');
    expect(slugOf('The store: backups, restore and PostgreSQL')).toBe('the-store-backups-restore-and-postgresql');
    expect([...anchorsIn('# A\n\n## Figures\n\n```\n## not a heading\n```\n\n## Figures\n')]).toEqual(['a', 'figures', 'figures-1']);
  });

  it('reads links in prose only, not in code, and leaves addresses with a scheme alone', () => {
    const text = 'See [a](a.md) and `[b](b.md)`.\n```\n[c](c.md)\n```\n[d](https://example.invalid/) [e](#here)';
    expect(linksIn(text)).toEqual([
      { line: 1, target: 'a.md' },
      { line: 5, target: '#here' },
    ]);
  });

  const scratch = mkdtempSync(path.join(tmpdir(), 'rigbook-doc-links-'));
  afterAll(() => rmSync(scratch, { recursive: true, force: true }));

  it('finds a missing file, a missing anchor and a missing heading in the same file', () => {
    mkdirSync(path.join(scratch, 'docs'));
    writeFileSync(path.join(scratch, 'docs', 'there.md'), '# There\n\n## A section\n');
    writeFileSync(path.join(scratch, 'GUIDE.md'), '# Guide\n\n[ok](docs/there.md#a-section) [gone](docs/gone.md)\n[no anchor](docs/there.md#b-section) [self](#nowhere) [folder](docs/)\n');
    expect(brokenLinks(scratch, 'GUIDE.md')).toEqual([
      'GUIDE.md:3 → docs/gone.md: no such file or folder',
      'GUIDE.md:4 → docs/there.md#b-section: no heading makes the anchor #b-section',
      'GUIDE.md:4 → #nowhere: no heading makes the anchor #nowhere',
    ]);
  });
});
