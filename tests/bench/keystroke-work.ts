// `npm run bench:keys`: what one keystroke in the builds list costs the page's main thread, for
// comparing renderer changes. The bench's keystroke figure (keydown → updated list painted) moves
// by a few milliseconds from run to run on a shared machine; this reads a Chromium trace instead
// and adds up the key's own task and the next frame's task, so two builds, or two style variants
// of one build, can be told apart in one sitting. It is a tool, not a budget: nothing fails.
//
//   RIGBOOK_KEYS_ROUNDS=5        rounds of the bench's key script (after one not counted)
//   RIGBOOK_KEYS_ROOT=DIR[,DIR]  folders holding builds (dist-main/, dist-renderer/) to measure
//                                instead of this checkout's; with several, each has its own
//                                server and page and they take turns round by round, for an A/B
//                                of two builds that the machine's drift over minutes cannot tilt
//   RIGBOOK_KEYS_VARIANTS=JSON   {"name": "css", …}: style sheets tried in turn, each round, on the
//                                same page (the page's CSP is bypassed for this alone), to see
//                                what a part of each row costs, e.g. {"base": "", "no badge":
//                                ".rows .badge { display: none }"}
//   RIGBOOK_KEYS_LABELS=1        also print the median of each key of the script
//   RIGBOOK_KEYS_KEYS=7,Backspace  press these keys instead of the bench's script (a pair that
//                                changes every row in view both ways makes the heaviest case)
//   RIGBOOK_KEYS_PREFIX=b        text in the search box before the keys (with RIGBOOK_KEYS_KEYS=o,Backspace:
//                                the step from one letter to two and back)
//   RIGBOOK_KEYS_PHASES=1        also print where a key's work goes: the trace events' own time
//                                (minus the events inside them), by task (the key's, the frame's)
//                                and name, mean a key
//   RIGBOOK_KEYS_CATEGORIES=blink,cc  more trace categories, for a finer split of the phases
//                                (they slow the page a little: compare phases, not figures)
//
// Builds and variants run in a new random order each round, so a machine slowing down over the
// minutes does not weigh on one of them. Besides the wall-clock work, the thread's own CPU time is given (it
// leaves out the moments the machine gave the thread's core to something else), with its mean:
// on a shared machine that is the steadier figure for telling two variants apart.

import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium, type Browser, type Page } from '@playwright/test';
import { CHROMIUM_FLAGS, findBrowser } from '../e2e/find-browser.mjs';
import { makeStore } from './fleet-stores';
import { ARM_KEYSTROKE, AWAIT_KEYSTROKE, FIRST_ROW_PROBE, type KeystrokeTimes } from './page-probes';
import { KEY_SCRIPT as BENCH_SCRIPT } from './shell-bench';
import { mean, median, percentile } from './stats';

const ROOT = path.resolve(import.meta.dirname, '..', '..');
const BUILDS = (process.env.RIGBOOK_KEYS_ROOT ?? ROOT).split(',').map((dir) => path.resolve(dir));
const ROUNDS = Math.max(1, Number(process.env.RIGBOOK_KEYS_ROUNDS ?? 5) || 5);
const KEY_SCRIPT = process.env.RIGBOOK_KEYS_KEYS ? process.env.RIGBOOK_KEYS_KEYS.split(',').map((key) => ({ key, label: key })) : BENCH_SCRIPT;
const VARIANTS = JSON.parse(process.env.RIGBOOK_KEYS_VARIANTS ?? '{"as built": ""}') as Record<string, string>;
const PHASES = process.env.RIGBOOK_KEYS_PHASES === '1';

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

/** One build's server and the page showing it. */
interface Shell {
  build: string;
  server: ChildProcess;
  page: Page;
}

interface Figures {
  work: number[];
  cpu: number[];
  keyTask: number[];
  frame: number[];
  latency: number[];
  byLabel: Map<string, number[]>;
  /** Trace events' own time by name, µs, over all keys. */
  phases: Map<string, number>;
}

async function openShell(browser: Browser, build: string, dbPath: string): Promise<Shell> {
  const entry = path.join(build, 'dist-main', 'local-main.cjs');
  if (!existsSync(entry)) throw new Error(`${entry} is missing: run npm run build first`);
  const token = `keys${Math.random().toString(36).slice(2)}`;
  const server = spawn(process.execPath, [entry, '--db', dbPath], { cwd: build, env: { ...process.env, RIGBOOK_TOKEN: token }, stdio: ['ignore', 'pipe', 'inherit'] });
  const url = await new Promise<string>((resolve, reject) => {
    let out = '';
    server.stdout!.on('data', (d: Buffer) => {
      out += d.toString();
      const m = /serving on (http:\/\/127\.0\.0\.1:\d+\/)/.exec(out);
      if (m?.[1]) resolve(m[1]);
    });
    server.once('exit', (code) => reject(new Error(`the shell of ${build} exited with ${code}`)));
  });
  const context = await browser.newContext({ viewport: { width: 1280, height: 800 }, bypassCSP: true });
  const page = await context.newPage();
  await page.addInitScript({ content: FIRST_ROW_PROBE });
  await page.goto(`${url}#token=${token}`);
  await page.waitForFunction(() => (window as unknown as { __rbFirstRow?: { done?: boolean } }).__rbFirstRow?.done === true, undefined, { timeout: 120_000, polling: 50 });
  await page.waitForTimeout(1500);
  const box = page.getByLabel('Search builds');
  await box.click();
  await box.fill(process.env.RIGBOOK_KEYS_PREFIX ?? '');
  await page.waitForTimeout(500);
  return { build, server, page };
}

/** Presses the key script once on `page` under a trace of its own, and adds each key's figures to `into` (unless it is a warm-up). */
async function measureBlock(browser: Browser, page: Page, css: string, into: Figures | null): Promise<void> {
  await page.evaluate(`(() => { const s = document.createElement('style'); s.id = 'keys-variant'; s.textContent = ${JSON.stringify(css)}; document.head.appendChild(s); })()`);
  await page.waitForTimeout(100);
  await browser.startTracing(page, { categories: ['devtools.timeline', 'toplevel', ...(process.env.RIGBOOK_KEYS_CATEGORIES ?? '').split(',').filter(Boolean)] });
  const latencies: number[] = [];
  const labels: string[] = [];
  for (const step of KEY_SCRIPT) {
    await page.evaluate(ARM_KEYSTROKE);
    await page.keyboard.press(step.key);
    const t = (await page.evaluate(AWAIT_KEYSTROKE)) as KeystrokeTimes;
    await page.waitForTimeout(60);
    latencies.push(t.painted - t.keydown);
    labels.push(step.label);
  }
  const events = (JSON.parse((await browser.stopTracing()).toString()) as { traceEvents: TraceEvent[] }).traceEvents;
  await page.evaluate(`document.getElementById('keys-variant').remove()`);
  if (!into) return;

  // The renderer's main thread is the one that paints most (another page's caret may blink); its top-level tasks, in order.
  const painting = new Map<string, number>();
  for (const e of events) if (e.name === 'Paint') painting.set(`${e.pid}:${e.tid}`, (painting.get(`${e.pid}:${e.tid}`) ?? 0) + 1);
  const main = [...painting].sort((a, b) => b[1] - a[1])[0]?.[0];
  const onMain = events.filter((e) => `${e.pid}:${e.tid}` === main && e.ph === 'X' && e.dur !== undefined).sort((a, b) => a.ts - b.ts);
  const tasks = onMain.filter((e) => e.name === 'ThreadControllerImpl::RunTask' || e.name === 'RunTask');
  const paints = onMain.filter((e) => e.name === 'Paint');
  const keydowns = onMain.filter((e) => e.name === 'EventDispatch' && e.args?.data?.type === 'keydown');
  if (keydowns.length !== KEY_SCRIPT.length) throw new Error(`the trace holds ${keydowns.length} keydowns for ${KEY_SCRIPT.length} keys pressed`);
  keydowns.forEach((keydown, i) => {
    const keyTask = tasks.find((t) => t.ts <= keydown.ts && t.ts + t.dur! >= keydown.ts + keydown.dur!);
    if (!keyTask) return;
    const end = keyTask.ts + keyTask.dur!;
    const frame = tasks.find((t) => t.ts >= end && paints.some((p) => p.ts >= t.ts && p.ts <= t.ts + t.dur!));
    const keyMs = keyTask.dur! / 1000;
    const frameMs = frame ? frame.dur! / 1000 : 0;
    into.work.push(keyMs + frameMs);
    into.cpu.push(((keyTask.tdur ?? keyTask.dur!) + (frame ? (frame.tdur ?? frame.dur!) : 0)) / 1000);
    into.keyTask.push(keyMs);
    into.frame.push(frameMs);
    into.latency.push(latencies[i]!);
    into.byLabel.set(labels[i]!, [...(into.byLabel.get(labels[i]!) ?? []), keyMs + frameMs]);
    if (PHASES) {
      addSelfTimes(onMain, keyTask, into.phases, 'key ');
      if (frame) addSelfTimes(onMain, frame, into.phases, 'frame ');
    }
  });
}

async function main(): Promise<void> {
  const browserPath = findBrowser().path;
  if (!browserPath) throw new Error('no Chromium found; set RIGBOOK_CHROMIUM');
  const folder = mkdtempSync(path.join(os.tmpdir(), 'rigbook-keys-'));
  const store = await makeStore(folder, 10_000);
  const browser = await chromium.launch({ executablePath: browserPath, args: CHROMIUM_FLAGS, headless: true });
  const shells: Shell[] = [];
  try {
    for (const build of BUILDS) shells.push(await openShell(browser, build, store.dbPath));
    const runs = shells.flatMap((shell) => Object.entries(VARIANTS).map(([variant, css]) => ({ shell, variant, css, name: BUILDS.length > 1 ? `${shell.build} ${variant}` : variant })));
    const figures = new Map(runs.map((r) => [r.name, { work: [], cpu: [], keyTask: [], frame: [], latency: [], byLabel: new Map(), phases: new Map() } as Figures]));
    for (let round = -1; round < ROUNDS; round++) {
      for (const run of shuffled(runs)) await measureBlock(browser, run.shell.page, run.css, round >= 0 ? figures.get(run.name)! : null);
    }
    process.stdout.write(`${BUILDS.join(' and ')}, ${ROUNDS} rounds of ${KEY_SCRIPT.length} keys, 10 000 builds; ms of main-thread work (the key's task + the next frame's), then keydown → painted\n`);
    const width = Math.max(16, ...runs.map((r) => r.name.length + 1));
    for (const [name, v] of figures) {
      process.stdout.write(
        `${name.padEnd(width)} work median ${median(v.work).toFixed(2)}, 90th ${percentile(v.work, 0.9).toFixed(2)} (key task ${median(v.keyTask).toFixed(2)}, frame ${median(v.frame).toFixed(2)}) | cpu mean ${mean(v.cpu).toFixed(2)}, median ${median(v.cpu).toFixed(2)} | latency median ${median(v.latency).toFixed(1)}, 90th ${percentile(v.latency, 0.9).toFixed(1)} | n=${v.work.length}\n`,
      );
      if (process.env.RIGBOOK_KEYS_LABELS === '1') for (const [label, xs] of v.byLabel) process.stdout.write(`    ${label.padEnd(28)} ${median(xs).toFixed(2)}\n`);
      if (PHASES) {
        const top = [...v.phases].sort((a, b) => b[1] - a[1]).slice(0, 18);
        process.stdout.write(`    own time a key: ${top.map(([event, us]) => `${event} ${(us / 1000 / v.work.length).toFixed(2)}`).join(', ')}\n`);
      }
    }
  } finally {
    await browser.close();
    for (const shell of shells) shell.server.kill('SIGTERM');
    rmSync(folder, { recursive: true, force: true });
  }
}

/** Adds each event's own time (its duration less that of the events directly inside it) within `task`, by name, in µs. */
function addSelfTimes(onMain: readonly TraceEvent[], task: TraceEvent, into: Map<string, number>, prefix: string): void {
  const end = task.ts + task.dur!;
  const inside = onMain.filter((e) => e.ts >= task.ts && e.ts + e.dur! <= end).sort((a, b) => a.ts - b.ts || b.dur! - a.dur!);
  const stack: { event: TraceEvent; children: number }[] = [];
  const close = (until: number) => {
    while (stack.length > 0 && stack.at(-1)!.event.ts + stack.at(-1)!.event.dur! <= until) {
      const done = stack.pop()!;
      const name = prefix + done.event.name;
      into.set(name, (into.get(name) ?? 0) + done.event.dur! - done.children);
      if (stack.length > 0) stack.at(-1)!.children += done.event.dur!;
    }
  };
  for (const e of inside) {
    close(e.ts);
    stack.push({ event: e, children: 0 });
  }
  close(Number.POSITIVE_INFINITY);
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
