// Child of the power-cut test: opens the store through openServiceHost (the pragmas the app
// runs with), optionally lowers `synchronous` to show the test can fail, and creates packs
// through the real handler map until killed, printing one acknowledgement per saved pack.
//
//   LD_PRELOAD=durable-shim.so RIGBOOK_DURABLE_DIR=DIR node durable-writer.cjs DB_PATH [SYNCHRONOUS]

import { openServiceHost } from '../../../src-main/service/open-service-host';

const [dbPath, synchronous] = process.argv.slice(2);

async function main(): Promise<void> {
  const host = await openServiceHost({ dbPath: dbPath!, actor: 'durable-writer' });
  if (synchronous) host.raw!.pragma(`synchronous = ${synchronous}`);
  const pragmas = {
    journal_mode: host.raw!.pragma('journal_mode', { simple: true }),
    synchronous: host.raw!.pragma('synchronous', { simple: true }),
    foreign_keys: host.raw!.pragma('foreign_keys', { simple: true }),
  };
  process.stdout.write(`${JSON.stringify({ t: 'ready', pragmas })}\n`);
  for (let i = 0; ; i++) {
    const result = await host.call('batteries.create', { name: `Power-cut pack ${i}`, chemistry: 'lipo', cellsSeries: 2, capacityMah: 1000 + i });
    if (!result.ok) {
      process.stdout.write(`${JSON.stringify({ t: 'unexpected', error: result.error })}\n`);
      process.exit(3);
    }
    process.stdout.write(`${JSON.stringify({ t: 'ack', id: (result.value as { id: string }).id })}\n`);
  }
}

main().catch((error: unknown) => {
  process.stderr.write(`${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`);
  process.exit(2);
});
