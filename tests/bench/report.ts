// The benchmark's table: every figure beside its budget (docs/performance.md) and whether it met
// it. A slow figure is reported, never thrown: the benchmark informs, it does not gate.

export interface Budget {
  /** The bound, in the figure's own unit. */
  max: number;
  /** The figure must stay under the bound ("< 16 ms"); otherwise it may reach it ("≤ 1.5×"). */
  strict: boolean;
  /** The budget in words, as docs/performance.md lists it. */
  text: string;
}

export interface Figure {
  group: string;
  name: string;
  /** The median, unless the name says otherwise. */
  value: number;
  unit: 'µs' | 'ms' | 's' | 'MB' | 'MiB' | '×' | 'rows';
  /** Worst run, spread or anything else worth reading beside the median. */
  detail?: string;
  budget?: Budget;
}

/** The budgets of docs/performance.md, quoted so the table says what each figure is held to. */
export const BUDGETS = {
  evaluation: { max: 20, strict: true, text: '< 20 µs (one build evaluation)' },
  operatingPoint: { max: 2, strict: true, text: '< 2 µs (one motor operating point)' },
  recheck10k: { max: 300, strict: true, text: '< 300 ms whole transaction, 10 000 builds' },
  recheckVsFloor: { max: 1.5, strict: false, text: '≤ 1.5× the raw floor (DESIGN §9 says 2×; held tighter)' },
  firstRows: { max: 150, strict: true, text: '< 150 ms data arrives → first rows' },
  keystroke: { max: 16, strict: true, text: '< 16 ms a keystroke' },
  coldStart: { max: 1500, strict: true, text: '< 1.5 s cold start → usable list' },
  // Sizes, not times: the same on any machine, so these verdicts do not depend on load.
  firstListPayload: { max: 1.5, strict: false, text: '≤ 1.5 MiB first builds list, 10 000 builds' },
  growthPerEdit: { max: 0.05, strict: false, text: '≤ 0.05 MiB store growth an edit of a part shared by 10 000 builds' },
} as const satisfies Record<string, Budget>;

export function formatValue(value: number, unit: Figure['unit']): string {
  if (!Number.isFinite(value)) return 'n/a';
  const digits = unit === 'µs' ? (value < 10 ? 2 : 1) : unit === '×' ? 2 : unit === 'MiB' ? 3 : unit === 'rows' || unit === 'MB' ? 0 : value < 10 ? 2 : value < 100 ? 1 : 0;
  const text = value.toLocaleString('en-US', { minimumFractionDigits: digits, maximumFractionDigits: digits });
  return unit === '×' ? `${text}×` : `${text} ${unit}`;
}

export function verdictOf(figure: Figure): 'met' | 'NOT MET' | '' {
  if (!figure.budget) return '';
  if (!Number.isFinite(figure.value)) return 'NOT MET';
  // As the budget reads: a keystroke of exactly 16 ms is not under 16 ms.
  const within = figure.budget.strict ? figure.value < figure.budget.max : figure.value <= figure.budget.max;
  return within ? 'met' : 'NOT MET';
}

function pad(text: string, width: number, right = false): string {
  const len = [...text].length;
  if (len >= width) return text;
  return right ? ' '.repeat(width - len) + text : text + ' '.repeat(width - len);
}

/** A plain-text table, one group after another. */
export function renderTable(figures: readonly Figure[]): string {
  const rows = figures.map((f) => ({
    group: f.group,
    name: f.name,
    value: formatValue(f.value, f.unit),
    detail: f.detail ?? '',
    budget: f.budget?.text ?? '—',
    verdict: verdictOf(f),
  }));
  const w = {
    name: Math.max(6, ...rows.map((r) => [...r.name].length)),
    value: Math.max(6, ...rows.map((r) => [...r.value].length)),
    detail: Math.max(6, ...rows.map((r) => [...r.detail].length)),
    budget: Math.max(6, ...rows.map((r) => [...r.budget].length)),
  };
  const lines: string[] = [];
  const header = `${pad('Figure', w.name)}  ${pad('Median', w.value, true)}  ${pad('Detail', w.detail)}  ${pad('Budget (DESIGN §9)', w.budget)}  Verdict`;
  lines.push(header, '-'.repeat([...header].length + 2));
  let group = '';
  for (const r of rows) {
    if (r.group !== group) {
      if (group !== '') lines.push('');
      lines.push(`[${r.group}]`);
      group = r.group;
    }
    lines.push(`${pad(r.name, w.name)}  ${pad(r.value, w.value, true)}  ${pad(r.detail, w.detail)}  ${pad(r.budget, w.budget)}  ${r.verdict}`);
  }
  return lines.join('\n');
}

/** The same figures as a Markdown table, for pasting into docs/performance.md. */
export function renderMarkdown(figures: readonly Figure[]): string {
  const lines = ['| Figure | Median | Detail | Budget (DESIGN §9) | |', '|---|---:|---|---|---|'];
  for (const f of figures) {
    lines.push(`| ${f.group}: ${f.name} | ${formatValue(f.value, f.unit)} | ${f.detail ?? ''} | ${f.budget?.text ?? '—'} | ${verdictOf(f)} |`);
  }
  return lines.join('\n');
}

/**
 * One line a script can read: every figure with its budget and verdict. Printed after the table
 * as `BENCH-JSON {…}` and, with `--json FILE`, written to that file.
 */
export function renderJson(figures: readonly Figure[], context: Record<string, unknown>): string {
  return JSON.stringify({
    ...context,
    figures: figures.map((f) => ({
      group: f.group,
      name: f.name,
      value: Number.isFinite(f.value) ? f.value : null,
      unit: f.unit,
      ...(f.budget ? { budget: f.budget.max, budgetText: f.budget.text, met: verdictOf(f) === 'met' } : {}),
      ...(f.detail ? { detail: f.detail } : {}),
    })),
  });
}
