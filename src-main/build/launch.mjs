// `npm start` (after the build): the desktop window where the desktop runtime is, else the
// browser shell with the default browser opened at it. `npm start -- --help` lists the options;
// the logic is in launcher.mjs.
import { spawn } from 'node:child_process';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { launch } from './launcher.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const require = createRequire(join(root, 'package.json'));

await launch(process.argv.slice(2), {
  env: process.env,
  platform: process.platform,
  root,
  spawn,
  requireElectron: () => require('electron'),
  log: (line) => console.log(line),
  error: (line) => console.error(line),
  write: (text) => process.stdout.write(text),
  exit: (code) => process.exit(code),
  onSignal: (signal, handler) => process.on(signal, handler),
});
