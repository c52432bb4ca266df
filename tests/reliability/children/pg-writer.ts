// Child of the PostgreSQL concurrency test: one bench writing to a shared store at the same time
// as the others. It adds one to a pack's cycle count `count` times, each time as a person would:
// read the pack, save the change with the version it read, and on a conflict read again and
// retry. Prints one JSON line at the end: {"saved":N,"conflicts":M}.
//
//   node pg-writer.cjs STORE_URL BATTERY_ID COUNT ACTOR

import { openServiceHost } from '../../../src-main/service/open-service-host';

const [url, batteryId, countText, actor] = process.argv.slice(2) as [string, string, string, string];

async function main(): Promise<void> {
  const host = await openServiceHost({ dbPath: url, actor });
  let saved = 0;
  let conflicts = 0;
  try {
    while (saved < Number(countText)) {
      const read = await host.call('batteries.get', { id: batteryId });
      if (!read.ok) throw new Error(`read: ${read.error.message}`);
      const pack = read.value as { version: number; cycleCount: number };
      const write = await host.call('batteries.update', { id: batteryId, expectedVersion: pack.version, changes: { cycleCount: pack.cycleCount + 1 }, reason: `${actor} cycle` });
      if (write.ok) saved++;
      else if (write.error.kind === 'conflict') conflicts++;
      else throw new Error(`write: ${write.error.kind}: ${write.error.message}`);
    }
  } finally {
    await host.close();
  }
  process.stdout.write(`${JSON.stringify({ saved, conflicts })}\n`);
}

main().catch((error: unknown) => {
  process.stderr.write(`${error instanceof Error ? error.message : String(error)}\n`);
  process.exit(1);
});
