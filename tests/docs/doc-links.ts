// Reads the relative links of the Markdown docs and says which ones lead nowhere: a file or
// folder that is not there, or an anchor that no heading of the target makes.
import { existsSync, readFileSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';

export interface DocLink {
  readonly line: number;
  readonly target: string;
}

/** The Markdown files whose links are checked: those at the top of the repository and in docs/. */
export function docFiles(root: string): string[] {
  const md = (dir: string) =>
    existsSync(dir)
      ? readdirSync(dir)
          .filter((name) => name.endsWith('.md'))
          .map((name) => path.relative(root, path.join(dir, name)))
      : [];
  return [...md(root), ...md(path.join(root, 'docs'))].sort();
}

/** Lines outside fenced code blocks, with inline code blanked, so an example is never read as a link. */
function proseLines(text: string): string[] {
  let fenced = false;
  return text.split('\n').map((line) => {
    if (/^\s*(```|~~~)/.test(line)) {
      fenced = !fenced;
      return '';
    }
    return fenced ? '' : line.replace(/`[^`]*`/g, '');
  });
}

/** Inline links `[text](target)` whose target is not an address with a scheme. */
export function linksIn(text: string): DocLink[] {
  const links: DocLink[] = [];
  proseLines(text).forEach((line, index) => {
    for (const match of line.matchAll(/\]\(([^)\s]+)(?:\s+"[^"]*")?\)/g)) {
      const target = match[1] ?? '';
      if (/^[a-z][a-z0-9+.-]*:/i.test(target)) continue;
      links.push({ line: index + 1, target });
    }
  });
  return links;
}

/** The anchor a heading gets where Markdown is rendered: lower case, punctuation dropped, spaces as hyphens. */
export function slugOf(heading: string): string {
  return heading
    .trim()
    .toLowerCase()
    .replace(/[^\p{L}\p{N}\s_-]/gu, '')
    .replace(/\s/g, '-');
}

/** Every anchor a Markdown text's headings make; a repeated heading gets -1, -2, … as rendered. */
export function anchorsIn(text: string): Set<string> {
  const anchors = new Set<string>();
  const seen = new Map<string, number>();
  for (const line of proseLinesKeepingCode(text)) {
    const match = /^#{1,6}\s+(.*?)\s*#*\s*$/.exec(line);
    if (!match) continue;
    const base = slugOf((match[1] ?? '').replace(/`/g, ''));
    const count = seen.get(base) ?? 0;
    seen.set(base, count + 1);
    anchors.add(count === 0 ? base : `${base}-${count}`);
  }
  return anchors;
}

/** Headings may hold inline code, whose text counts toward the anchor. */
function proseLinesKeepingCode(text: string): string[] {
  let fenced = false;
  return text.split('\n').map((line) => {
    if (/^\s*(```|~~~)/.test(line)) {
      fenced = !fenced;
      return '';
    }
    return fenced ? '' : line;
  });
}

/** One sentence per link of `file` (relative to `root`) that leads nowhere. */
export function brokenLinks(root: string, file: string, read: (p: string) => string = (p) => readFileSync(p, 'utf8')): string[] {
  const from = path.join(root, file);
  const problems: string[] = [];
  for (const link of linksIn(read(from))) {
    const [rawPath = '', anchor] = link.target.split('#', 2);
    const target = rawPath === '' ? from : path.resolve(path.dirname(from), decodeURIComponent(rawPath));
    const where = `${file}:${link.line} → ${link.target}`;
    if (!existsSync(target)) {
      problems.push(`${where}: no such file or folder`);
      continue;
    }
    if (anchor === undefined || anchor === '') continue;
    if (statSync(target).isDirectory() || !target.endsWith('.md')) {
      problems.push(`${where}: an anchor into something that is not a Markdown file`);
      continue;
    }
    if (!anchorsIn(read(target)).has(anchor)) problems.push(`${where}: no heading makes the anchor #${anchor}`);
  }
  return problems;
}
