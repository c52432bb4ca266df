import { existsSync } from 'node:fs';
import path from 'node:path';
import { resolveDbPath } from '../store/data-location';
import { AUTO_BACKUPS_KEPT, openServiceHost } from '../service/open-service-host';
import { startLocalServer } from './local-server';
import { describeStorageError } from '../store/storage-errors';

// Entry of the loopback shell: `node dist-main/local-main.cjs [--db PATH] [--port N]`.

function argValue(args: string[], flag: string): string | undefined {
  const at = args.indexOf(flag);
  return at >= 0 ? args[at + 1] : args.find((a) => a.startsWith(`${flag}=`))?.slice(flag.length + 1);
}

function rendererDir(): string {
  const candidates = [path.resolve(__dirname, '../dist-renderer'), path.resolve(process.cwd(), 'dist-renderer')];
  return candidates.find((dir) => existsSync(path.join(dir, 'index.html'))) ?? candidates[0]!;
}

async function main(): Promise<void> {
  const args = process.argv.slice(2);
  const dbPath = resolveDbPath(argValue(args, '--db'));
  const portText = argValue(args, '--port') ?? process.env.RIGBOOK_PORT;
  const port = portText === undefined ? 0 : Number(portText);
  if (!Number.isInteger(port) || port < 0 || port > 65535) throw new Error(`--port: "${portText}" is not a port number`);
  const host = await openServiceHost({ dbPath, autoBackup: { keep: AUTO_BACKUPS_KEPT } });
  const server = await startLocalServer({ host, rendererDir: rendererDir(), port, token: process.env.RIGBOOK_TOKEN });
  process.stdout.write(`Rigbook is serving on ${server.url} (this computer only)\nStore: ${dbPath}\nOpen: ${server.openUrl}\n`);
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
  const cause = error instanceof Error ? error.message : String(error);
  process.stderr.write(storage ? `Rigbook could not start. ${storage.message}\n  (${storage.code}: ${cause})\n` : `Rigbook could not start: ${cause}\n`);
  process.exit(1);
});
