import { existsSync } from 'node:fs';
import path from 'node:path';
import { resolveDbPath } from '../store/data-location';
import { AUTO_BACKUP_AFTER_START_MS, AUTO_BACKUPS_KEPT, openServiceHost } from '../service/open-service-host';
import { demoFleet } from '../../demo-fixtures/demo-fleet';
import { startLocalServer } from './local-server';
import { LOCAL_HELP, parseLocalArgs } from './command-line';
import { EXIT } from '../shell-common/exit-codes';
import { describeStorageError } from '../store/storage-errors';
import { redactUrl, withoutSecret } from '../store/store-location';

// Entry of the loopback shell: `node dist-main/local-main.cjs [--db PATH] [--port N]` (--help lists the options).

function rendererDir(): string {
  const candidates = [path.resolve(__dirname, '../dist-renderer'), path.resolve(process.cwd(), 'dist-renderer')];
  return candidates.find((dir) => existsSync(path.join(dir, 'index.html'))) ?? candidates[0]!;
}

/** The store being opened, so a failure's message can be cleared of its password. */
let chosenStore = '';

async function main(): Promise<void> {
  const command = parseLocalArgs(process.argv.slice(2));
  if (command.kind === 'help') {
    process.stdout.write(LOCAL_HELP);
    return;
  }
  if (command.kind === 'refused') {
    process.stderr.write(`Rigbook did not start: ${command.message}. See node dist-main/local-main.cjs --help.\n`);
    process.exitCode = EXIT.usage;
    return;
  }
  const { port } = command;
  const dbPath = resolveDbPath(command.db);
  chosenStore = dbPath;
  const host = await openServiceHost({ dbPath, demoFleet, autoBackup: { keep: AUTO_BACKUPS_KEPT, afterStartMs: AUTO_BACKUP_AFTER_START_MS } });
  const server = await startLocalServer({ host, rendererDir: rendererDir(), port, token: process.env.RIGBOOK_TOKEN });
  process.stdout.write(`Rigbook is serving on ${server.url} (this computer only)\nStore: ${redactUrl(dbPath)}\nOpen: ${server.openUrl}\n`);
  const stop = async () => {
    await server.close();
    await host.close();
    process.exit(0);
  };
  process.on('SIGINT', () => void stop());
  process.on('SIGTERM', () => void stop());
}

main().catch((error: unknown) => {
  const storage = describeStorageError(error);
  // The store's URL may carry a password; nothing printed may show it.
  const cause = withoutSecret(error instanceof Error ? error.message : String(error), chosenStore);
  process.stderr.write(storage ? `Rigbook could not start. ${storage.message}\n  (${storage.code}: ${cause})\n` : `Rigbook could not start: ${cause}\n`);
  process.exit(1);
});
