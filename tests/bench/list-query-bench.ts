// The builds list as the service answers it (`builds.list` through the handler map), with and
// without a filter, and the compact column form (`builds.listColumns`) the window asks for at start.

import { openServiceHost } from '../../src-main/service/open-service-host';
import { median, settle, worst } from './stats';

export interface ListQuery {
  name: string;
  args: Record<string, unknown>;
  handler?: string;
  medianMs: number;
  worstMs: number;
  rows: number;
  /** Size of the answer as JSON, what the loopback shell sends. */
  jsonBytes: number;
}

export const LIST_QUERIES: readonly { name: string; args: Record<string, unknown>; handler?: string }[] = [
  { name: 'column form, no filter (what the window loads)', args: {}, handler: 'builds.listColumns' },
  { name: 'row objects, no filter', args: {} },
  { name: 'text filter "customer 1"', args: { text: 'customer 1' } },
  { name: 'verdict filter over', args: { statuses: ['over'] } },
];

export async function benchListQueries(dbPath: string, runs: number): Promise<ListQuery[]> {
  const host = await openServiceHost({ dbPath, actor: 'bench' });
  try {
    const out: ListQuery[] = [];
    for (const q of LIST_QUERIES) {
      const times: number[] = [];
      let rows = 0;
      let jsonBytes = 0;
      for (let r = -1; r < runs; r++) {
        await settle();
        const started = performance.now();
        const answer = await host.call(q.handler ?? 'builds.list', q.args);
        const ms = performance.now() - started;
        if (!answer.ok) throw new Error(`builds.list ${JSON.stringify(q.args)}: ${answer.error.message}`);
        const value = answer.value as unknown[] | { rows: number };
        rows = Array.isArray(value) ? value.length : value.rows;
        if (r < 0) jsonBytes = Buffer.byteLength(JSON.stringify(value));
        else times.push(ms);
      }
      out.push({ ...q, medianMs: median(times), worstMs: worst(times), rows, jsonBytes });
    }
    return out;
  } finally {
    await host.close();
  }
}
