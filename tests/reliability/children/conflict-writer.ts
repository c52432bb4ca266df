// Child of the conflicts test: a second workstation on the same store file. It reads one
// JSON command per stdin line and answers with one JSON line on stdout.
//
//   {"op":"call","name":...,"args":...}        → {"t":"result","result":CallResult}
//   {"op":"pausedCall","name":...,"args":...}  → {"t":"paused"} once the call has read inside its
//                                                transaction, then, after {"op":"go"}, {"t":"result",...}
//   {"op":"lock"} / {"op":"unlock"}            → holds / commits a raw write transaction
//
//   node conflict-writer.cjs DB_PATH ACTOR

import Database from 'better-sqlite3';
import { createInterface } from 'node:readline';
import { openPausableService } from '../support/paused-service';

const [dbPath, actor] = process.argv.slice(2) as [string, string];

function out(line: unknown): void {
  process.stdout.write(`${JSON.stringify(line)}\n`);
}

async function main(): Promise<void> {
  const service = await openPausableService(dbPath, actor);
  const raw = new Database(dbPath);
  raw.pragma('busy_timeout = 5000');
  let release: (() => void) | null = null;
  out({ t: 'ready' });
  for await (const text of createInterface({ input: process.stdin })) {
    const command = JSON.parse(text) as { op: string; name?: string; args?: unknown };
    if (command.op === 'call') {
      out({ t: 'result', result: await service.call(command.name ?? '', command.args) });
    } else if (command.op === 'pausedCall') {
      const started = await service.callPaused(command.name ?? '', command.args);
      release = started.release;
      out({ t: 'paused' });
      void started.done.then((result) => out({ t: 'result', result }));
    } else if (command.op === 'go') {
      release?.();
      release = null;
    } else if (command.op === 'lock') {
      raw.exec('begin immediate');
      raw.prepare('insert into settings (key, value) values (?, ?) on conflict (key) do update set value = excluded.value').run('lockProbe', JSON.stringify(actor));
      out({ t: 'locked' });
    } else if (command.op === 'unlock') {
      raw.exec('commit');
      out({ t: 'unlocked' });
    }
  }
  raw.close();
  await service.close();
}

main().catch((error: unknown) => {
  out({ t: 'failed', error: error instanceof Error ? error.message : String(error) });
  process.exit(4);
});
