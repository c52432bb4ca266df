// The loopback shell as a user meets it: `node dist-main/local-main.cjs --db FILE` started cold
// on a 10 000-build store, the page opened in real Chromium, timed until the first build rows
// are painted; then keystrokes in the filter box timed inside the page, a re-check through the
// HTTP API, and the server process's peak memory.

import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type Page } from '@playwright/test';
import { HOT_MOTOR_ID } from '../../demo-fixtures/generate-fleet';
import { CHROMIUM_FLAGS, findBrowser } from '../e2e/find-browser.mjs';
import { ARM_KEYSTROKE, AWAIT_KEYSTROKE, FIRST_ROW_PROBE, READ_FIRST_ROW, type FirstRowTimes, type KeystrokeTimes } from './page-probes';

const ROOT = path.resolve(import.meta.dirname, '..', '..');
const ENTRY = path.join(ROOT, 'dist-main', 'local-main.cjs');
const RENDERER = path.join(ROOT, 'dist-renderer', 'index.html');

export interface ColdStart {
  /** Process spawned → first build rows painted. */
  totalMs: number;
  /** Process spawned → the shell printed its address (node start, store open, backup at start, migrations check). */
  serveMs: number;
  /** Address printed → the page's navigation began (the browser asked for the page). */
  navigateMs: number;
  /** Navigation → the builds.list request sent (the page's HTML, its script loaded and run, the app mounted). */
  appStartMs: number | null;
  /** The builds.list request: sent → first byte (the server's query and JSON), first byte → last byte. */
  listServerMs: number | null;
  listTransferMs: number | null;
  /** Last byte → performance.mark('rigbook:builds-data') (the JSON parsed in the page). */
  parseMs: number | null;
  /** Address printed → the list's data in the page (navigation, app start, the call, its JSON). */
  toDataMs: number | null;
  /** performance.mark('rigbook:builds-data') → first row painted. */
  dataToRowsMs: number | null;
}

export interface Keystroke {
  label: string;
  /**
   * Keydown → the updated list painted. Headless Chromium draws the next frame as soon as the
   * key's task is done (a trace shows the frame starting within a fraction of a millisecond), so
   * this is the main-thread work the key costs: the budget's figure.
   */
  latencyMs: number;
  /** Keydown → the last DOM change: the input event, the filter and the list's update in script. */
  scriptMs: number;
  /** The rest: style, layout (the text field's editing forces it inside the key's task) and paint. */
  renderMs: number;
  countText: string;
}

export interface ShellBench {
  browserPath: string;
  builtNow: boolean;
  /** Sources changed after the bundles were built. */
  stale: boolean;
  warmup: ColdStart;
  starts: ColdStart[];
  keystrokes: Keystroke[];
  /** Server process memory, kB, from /proc/<pid>/status. */
  memory: { afterStart: { hwmKb: number; rssKb: number }; afterRecheck: { hwmKb: number; rssKb: number }; recheckMs: number };
}

function newestIn(dir: string): number {
  let newest = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    newest = Math.max(newest, entry.isDirectory() ? newestIn(full) : statSync(full).mtimeMs);
  }
  return newest;
}

/** True when a source file changed after the bundles were built: the figures are then the old build's. */
export function bundlesStale(): boolean {
  const built = Math.min(statSync(ENTRY).mtimeMs, statSync(RENDERER).mtimeMs);
  return newestIn(path.join(ROOT, 'src-main')) > built || newestIn(path.join(ROOT, 'src-renderer')) > built;
}

/** Builds the bundles when they are missing (`npm run build`); an existing build is used as it is. */
export function ensureBuilt(): boolean {
  if (existsSync(ENTRY) && existsSync(RENDERER)) return false;
  process.stdout.write('dist-main or dist-renderer is missing: running npm run build …\n');
  const result = spawnSync('npm', ['run', 'build'], { cwd: ROOT, stdio: 'inherit' });
  if (result.status !== 0) throw new Error('npm run build failed');
  return true;
}

interface Running {
  child: ChildProcess;
  pid: number;
  spawnedAt: number;
  servingAt: number;
  url: string;
  token: string;
}

function epochNow(): number {
  return performance.timeOrigin + performance.now();
}

async function startShell(dbPath: string): Promise<Running> {
  const token = `bench${Math.random().toString(36).slice(2)}`;
  const spawnedAt = epochNow();
  const child = spawn(process.execPath, [ENTRY, '--db', dbPath], { cwd: ROOT, env: { ...process.env, RIGBOOK_TOKEN: token }, stdio: ['ignore', 'pipe', 'pipe'] });
  const { url, servingAt } = await new Promise<{ url: string; servingAt: number }>((resolve, reject) => {
    let out = '';
    const timer = setTimeout(() => reject(new Error(`the shell did not start in 60 s: ${out}`)), 60_000);
    child.stdout?.on('data', (d: Buffer) => {
      const at = epochNow();
      out += d.toString();
      const m = /serving on (http:\/\/127\.0\.0\.1:\d+\/)/.exec(out);
      if (m?.[1]) {
        clearTimeout(timer);
        resolve({ url: m[1], servingAt: at });
      }
    });
    child.stderr?.on('data', (d: Buffer) => (out += d.toString()));
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`the shell exited with ${code}: ${out}`));
    });
  });
  if (child.pid === undefined) throw new Error('the shell has no process id');
  return { child, pid: child.pid, spawnedAt, servingAt, url, token };
}

async function stopShell(shell: Running): Promise<void> {
  if (shell.child.exitCode !== null) return;
  const exited = new Promise<void>((resolve) => shell.child.once('exit', () => resolve()));
  shell.child.kill('SIGTERM');
  await Promise.race([exited, new Promise((resolve) => setTimeout(resolve, 5000))]);
  if (shell.child.exitCode === null) shell.child.kill('SIGKILL');
}

function readMemory(pid: number): { hwmKb: number; rssKb: number } {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8');
  const kb = (key: string) => Number(new RegExp(`^${key}:\\s+(\\d+) kB`, 'm').exec(status)?.[1] ?? Number.NaN);
  return { hwmKb: kb('VmHWM'), rssKb: kb('VmRSS') };
}

async function api<T>(shell: Running, name: string, args: unknown): Promise<T> {
  const res = await fetch(`${shell.url}api/${name}`, { method: 'POST', headers: { 'content-type': 'application/json', 'x-rigbook-token': shell.token }, body: JSON.stringify(args) });
  const body = (await res.json()) as { ok: boolean; value?: T; error?: { message: string } };
  if (!body.ok) throw new Error(`${name}: ${body.error?.message}`);
  return body.value as T;
}

async function coldStart(browser: Browser, dbPath: string): Promise<{ times: ColdStart; shell: Running; page: Page; close: () => Promise<void> }> {
  // The tab is made before the process starts, so the browser's own start-up is not billed to the shell.
  const context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
  let shell: Running | null = null;
  const close = async () => {
    await context.close();
    if (shell) await stopShell(shell);
  };
  try {
    const page = await context.newPage();
    await page.addInitScript({ content: FIRST_ROW_PROBE });
    shell = await startShell(dbPath);
    await page.goto(`${shell.url}#token=${shell.token}`);
    // A function, not text: the page's CSP forbids eval, which a text predicate would need. It
    // declares no named function inside, so the loader adds no helper the page lacks.
    await page.waitForFunction(() => (window as unknown as { __rbFirstRow?: { done?: boolean } }).__rbFirstRow?.done === true, undefined, { timeout: 60_000, polling: 50 });
    const probe = (await page.evaluate(READ_FIRST_ROW)) as FirstRowTimes;
    const painted = probe.timeOrigin + probe.firstRowPainted;
    const request = probe.listRequest;
    const times: ColdStart = {
      totalMs: painted - shell.spawnedAt,
      serveMs: shell.servingAt - shell.spawnedAt,
      navigateMs: probe.timeOrigin - shell.servingAt,
      appStartMs: request ? request.start : null,
      listServerMs: request ? request.responseStart - request.start : null,
      listTransferMs: request ? request.end - request.responseStart : null,
      parseMs: request && probe.dataMark !== null ? probe.dataMark - request.end : null,
      toDataMs: probe.dataMark === null ? null : probe.timeOrigin + probe.dataMark - shell.servingAt,
      dataToRowsMs: probe.dataMark === null ? null : probe.firstRowPainted - probe.dataMark,
    };
    return { times, shell, page, close };
  } catch (error) {
    await close();
    throw error;
  }
}

/**
 * Keystrokes in the filter box, each from a settled list, chosen to move the match count a lot
 * and a little: all 10 000 rows to none and back, a digit narrowing step by step, a word.
 * Generated names are "Build 123", owners "Owner 12", vehicles "truck 40"; nothing holds a "z".
 */
export const KEY_SCRIPT: readonly { key: string; label: string }[] = [
  { key: '7', label: "'' → '7'" },
  { key: '7', label: "'7' → '77'" },
  { key: '7', label: "'77' → '777'" },
  { key: 'Backspace', label: "'777' → '77'" },
  { key: 'Backspace', label: "'77' → '7'" },
  { key: 'Backspace', label: "'7' → ''" },
  { key: 'z', label: "'' → 'z' (no match)" },
  { key: 'Backspace', label: "'z' → '' (all rows back)" },
  { key: 'b', label: "'' → 'b'" },
  { key: 'o', label: "'b' → 'bo'" },
  { key: 'a', label: "'bo' → 'boa'" },
  { key: 'Backspace', label: "'boa' → 'bo'" },
  { key: 'Backspace', label: "'bo' → 'b'" },
  { key: 'Backspace', label: "'b' → ''" },
];

async function measureKeystrokes(page: Page, rounds: number): Promise<Keystroke[]> {
  const box = page.getByLabel('Search builds');
  await box.click();
  await box.fill('');
  const out: Keystroke[] = [];
  for (let round = -1; round < rounds; round++) {
    for (const step of KEY_SCRIPT) {
      await page.evaluate(ARM_KEYSTROKE);
      await page.keyboard.press(step.key);
      const t = (await page.evaluate(AWAIT_KEYSTROKE)) as KeystrokeTimes;
      // A quiet moment between keys, as between a person's keystrokes.
      await page.waitForTimeout(60);
      if (round < 0) continue; // the first round warms the page's code paths
      const latencyMs = t.painted - t.keydown;
      const scriptMs = (t.lastMutation ?? t.keydown) - t.keydown;
      out.push({ label: step.label, latencyMs, scriptMs, renderMs: latencyMs - scriptMs, countText: t.countText });
    }
  }
  return out;
}

export async function benchShell(dbPath: string, starts: number, keyRounds: number, onProgress: (line: string) => void = () => {}): Promise<ShellBench> {
  const builtNow = ensureBuilt();
  const found = findBrowser();
  if (!found.path) throw new Error(`no Chromium found (looked for ${found.tried.join(', ')}); set RIGBOOK_CHROMIUM`);
  const browser = await chromium.launch({ executablePath: found.path, args: CHROMIUM_FLAGS, headless: true });
  try {
    // The first start is not counted: it fills the page cache and, if the bundle's rules engine
    // is newer than the store's verdicts, re-checks every build once.
    const first = await coldStart(browser, dbPath);
    await first.close();
    onProgress(`  warm-up start ${first.times.totalMs.toFixed(0)} ms`);
    const timed: ColdStart[] = [];
    for (let i = 0; i < starts; i++) {
      const run = await coldStart(browser, dbPath);
      timed.push(run.times);
      onProgress(`  cold start ${i + 1}/${starts}: ${run.times.totalMs.toFixed(0)} ms`);
      if (i < starts - 1) {
        await run.close();
        continue;
      }
      // The last start stays up for the keystrokes, the re-check and the memory reading.
      try {
        const afterStart = readMemory(run.shell.pid);
        const keystrokes = await measureKeystrokes(run.page, keyRounds);
        onProgress(`  ${keystrokes.length} keystrokes timed`);
        const motor = await api<{ version: number; maxCurrentA: number }>(run.shell, 'motors.get', { id: HOT_MOTOR_ID });
        const started = performance.now();
        await api(run.shell, 'motors.update', { id: HOT_MOTOR_ID, expectedVersion: motor.version, changes: { maxCurrentA: motor.maxCurrentA === 150 ? 151 : 150 }, reason: 'benchmark: re-check with the window open' });
        const recheckMs = performance.now() - started;
        // The open window follows the change and reads the list again; let it.
        await run.page.waitForTimeout(1500);
        const afterRecheck = readMemory(run.shell.pid);
        return { browserPath: found.path, builtNow, stale: bundlesStale(), warmup: first.times, starts: timed, keystrokes, memory: { afterStart, afterRecheck, recheckMs } };
      } finally {
        await run.close();
      }
    }
    throw new Error('no cold start was run');
  } finally {
    await browser.close();
  }
}
