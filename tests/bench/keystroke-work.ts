// `npm run bench:keys`: what one keystroke in the builds list costs the page's main thread, for
// comparing renderer changes. The bench's keystroke figure (keydown → updated list painted) moves
// by a few milliseconds from run to run on a shared machine; this reads a Chromium trace instead
// and adds up the key's own task and the next frame's task, so two builds, or two style variants
// of one build, can be told apart in one sitting. It is a tool, not a budget: nothing fails.
//
//   RIGBOOK_KEYS_ROUNDS=5        rounds of the bench's key script (after one not counted)
//   RIGBOOK_KEYS_ROOT=DIR        a folder holding another build (dist-main/, dist-renderer/) to
//                                measure instead of this checkout's, for an A/B of two builds
//   RIGBOOK_KEYS_VARIANTS=JSON   {"name": "css", …}: style sheets tried in turn, each round, on the
//                                same page (the page's CSP is bypassed for this alone), to see
//                                what a part of each row costs, e.g. {"base": "", "no badge":
//                                ".rows .badge { display: none }"}
//   RIGBOOK_KEYS_LABELS=1        also print the median of each key of the script
//   RIGBOOK_KEYS_KEYS=7,Backspace  press these keys instead of the bench's script (a pair that
//                                changes every row in view both ways makes the heaviest case)
//
// Variants run in a new random order each round, so a machine slowing down over the minutes does
// not weigh on one of them. Besides the wall-clock work, the thread's own CPU time is given (it
// leaves out the moments the machine gave the thread's core to something else), with its mean:
// on a shared machine that is the steadier figure for telling two variants apart.

import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium } from '@playwright/test';
import { CHROMIUM_FLAGS, findBrowser } from '../e2e/find-browser.mjs';
import { makeStore } from './fleet-stores';
import { ARM_KEYSTROKE, AWAIT_KEYSTROKE, FIRST_ROW_PROBE, type KeystrokeTimes } from './page-probes';
import { KEY_SCRIPT as BENCH_SCRIPT } from './shell-bench';
import { mean, median, percentile } from './stats';

const ROOT = path.resolve(import.meta.dirname, '..', '..');
const BUILD = path.resolve(process.env.RIGBOOK_KEYS_ROOT ?? ROOT);
const ROUNDS = Math.max(1, Number(process.env.RIGBOOK_KEYS_ROUNDS ?? 5) || 5);
const KEY_SCRIPT = process.env.RIGBOOK_KEYS_KEYS ? process.env.RIGBOOK_KEYS_KEYS.split(',').map((key) => ({ key, label: key })) : BENCH_SCRIPT;
const VARIANTS = JSON.parse(process.env.RIGBOOK_KEYS_VARIANTS ?? '{"as built": ""}') as Record<string, string>;

interface TraceEvent {
  name: string;
  ph: string;
  ts: number;
  dur?: number;
  /** The thread's own CPU time over the event, where the trace has it. */
  tdur?: number;
  pid: number;
  tid: number;
  args?: { data?: { type?: string } };
}

async function main(): Promise<void> {
  const entry = path.join(BUILD, 'dist-main', 'local-main.cjs');
  if (!existsSync(entry)) throw new Error(`${entry} is missing: run npm run build first`);
  const browserPath = findBrowser().path;
  if (!browserPath) throw new Error('no Chromium found; set RIGBOOK_CHROMIUM');
  const folder = mkdtempSync(path.join(os.tmpdir(), 'rigbook-keys-'));
  const store = await makeStore(folder, 10_000);
  const token = `keys${Math.random().toString(36).slice(2)}`;
  const shell = spawn(process.execPath, [entry, '--db', store.dbPath], { cwd: BUILD, env: { ...process.env, RIGBOOK_TOKEN: token }, stdio: ['ignore', 'pipe', 'inherit'] });
  const browser = await chromium.launch({ executablePath: browserPath, args: CHROMIUM_FLAGS, headless: true });
  try {
    const url = await new Promise<string>((resolve, reject) => {
      let out = '';
      shell.stdout.on('data', (d: Buffer) => {
        out += d.toString();
        const m = /serving on (http:\/\/127\.0\.0\.1:\d+\/)/.exec(out);
        if (m?.[1]) resolve(m[1]);
      });
      shell.once('exit', (code) => reject(new Error(`the shell exited with ${code}`)));
    });
    const context = await browser.newContext({ viewport: { width: 1280, height: 800 }, bypassCSP: true });
    const page = await context.newPage();
    await page.addInitScript({ content: FIRST_ROW_PROBE });
    await page.goto(`${url}#token=${token}`);
    await page.waitForFunction(() => (window as unknown as { __rbFirstRow?: { done?: boolean } }).__rbFirstRow?.done === true, undefined, { timeout: 120_000, polling: 50 });
    await page.waitForTimeout(1500);
    const box = page.getByLabel('Search builds');
    await box.click();
    await box.fill('');

    const keys: { variant: string; label: string; latency: number; counted: boolean }[] = [];
    await browser.startTracing(page, { categories: ['devtools.timeline', 'toplevel'] });
    for (let round = -1; round < ROUNDS; round++) {
      for (const [variant, css] of shuffled(Object.entries(VARIANTS))) {
        await page.evaluate(`(() => { const s = document.createElement('style'); s.id = 'keys-variant'; s.textContent = ${JSON.stringify(css)}; document.head.appendChild(s); })()`);
        await page.waitForTimeout(100);
        for (const step of KEY_SCRIPT) {
          await page.evaluate(ARM_KEYSTROKE);
          await page.keyboard.press(step.key);
          const t = (await page.evaluate(AWAIT_KEYSTROKE)) as KeystrokeTimes;
          await page.waitForTimeout(60);
          keys.push({ variant, label: step.label, latency: t.painted - t.keydown, counted: round >= 0 });
        }
        await page.evaluate(`document.getElementById('keys-variant').remove()`);
      }
    }
    const events = (JSON.parse((await browser.stopTracing()).toString()) as { traceEvents: TraceEvent[] }).traceEvents;

    // The renderer's main thread is the one that paints; its top-level tasks, in order.
    const painting = new Map<string, number>();
    for (const e of events) if (e.name === 'Paint') painting.set(`${e.pid}:${e.tid}`, (painting.get(`${e.pid}:${e.tid}`) ?? 0) + 1);
    const main = [...painting].sort((a, b) => b[1] - a[1])[0]?.[0];
    const onMain = events.filter((e) => `${e.pid}:${e.tid}` === main && e.ph === 'X' && e.dur !== undefined).sort((a, b) => a.ts - b.ts);
    const tasks = onMain.filter((e) => e.name === 'ThreadControllerImpl::RunTask' || e.name === 'RunTask');
    const paints = onMain.filter((e) => e.name === 'Paint');
    const keydowns = onMain.filter((e) => e.name === 'EventDispatch' && e.args?.data?.type === 'keydown');
    if (keydowns.length !== keys.length) throw new Error(`the trace holds ${keydowns.length} keydowns for ${keys.length} keys pressed`);

    const byVariant = new Map<string, { work: number[]; cpu: number[]; keyTask: number[]; frame: number[]; latency: number[]; byLabel: Map<string, number[]> }>();
    keydowns.forEach((keydown, i) => {
      const key = keys[i]!;
      if (!key.counted) return;
      const keyTask = tasks.find((t) => t.ts <= keydown.ts && t.ts + t.dur! >= keydown.ts + keydown.dur!);
      if (!keyTask) return;
      const end = keyTask.ts + keyTask.dur!;
      const frame = tasks.find((t) => t.ts >= end && paints.some((p) => p.ts >= t.ts && p.ts <= t.ts + t.dur!));
      const keyMs = keyTask.dur! / 1000;
      const frameMs = frame ? frame.dur! / 1000 : 0;
      const v = byVariant.get(key.variant) ?? { work: [], cpu: [], keyTask: [], frame: [], latency: [], byLabel: new Map<string, number[]>() };
      byVariant.set(key.variant, v);
      v.work.push(keyMs + frameMs);
      v.cpu.push(((keyTask.tdur ?? keyTask.dur!) + (frame ? (frame.tdur ?? frame.dur!) : 0)) / 1000);
      v.keyTask.push(keyMs);
      v.frame.push(frameMs);
      v.latency.push(key.latency);
      v.byLabel.set(key.label, [...(v.byLabel.get(key.label) ?? []), keyMs + frameMs]);
    });
    process.stdout.write(`build ${BUILD}, ${ROUNDS} rounds of ${KEY_SCRIPT.length} keys, 10 000 builds; ms of main-thread work (the key's task + the next frame's), then keydown → painted\n`);
    for (const [variant, v] of byVariant) {
      process.stdout.write(
        `${variant.padEnd(16)} work median ${median(v.work).toFixed(2)}, 90th ${percentile(v.work, 0.9).toFixed(2)} (key task ${median(v.keyTask).toFixed(2)}, frame ${median(v.frame).toFixed(2)}) | cpu mean ${mean(v.cpu).toFixed(2)}, median ${median(v.cpu).toFixed(2)} | latency median ${median(v.latency).toFixed(1)}, 90th ${percentile(v.latency, 0.9).toFixed(1)} | n=${v.work.length}\n`,
      );
      if (process.env.RIGBOOK_KEYS_LABELS === '1') for (const [label, xs] of v.byLabel) process.stdout.write(`    ${label.padEnd(28)} ${median(xs).toFixed(2)}\n`);
    }
  } finally {
    await browser.close();
    shell.kill('SIGTERM');
    rmSync(folder, { recursive: true, force: true });
  }
}

function shuffled<T>(items: readonly T[]): T[] {
  const out = [...items];
  for (let i = out.length - 1; i > 0; i--) {
    const j = Math.floor(Math.random() * (i + 1));
    [out[i], out[j]] = [out[j]!, out[i]!];
  }
  return out;
}

main().catch((error: unknown) => {
  process.stderr.write(`${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`);
  process.exit(1);
});
