import type { ChildProcess, SpawnOptions } from 'node:child_process';

export type Spawn = (command: string, args: string[], options: SpawnOptions) => ChildProcess;

export interface LaunchSystem {
  env: NodeJS.ProcessEnv;
  platform: NodeJS.Platform;
  root: string;
  /** The one call that starts a process: shells, the runtime download and the browser opener. */
  spawn: Spawn;
  requireElectron(): unknown;
  exists?: (path: string) => boolean;
  log(line: string): void;
  error(line: string): void;
  write(text: string): void;
  exit(code: number): void;
  onSignal(signal: NodeJS.Signals, handler: () => void): void;
  stallMs?: number;
}

export declare const STALL_MS: number;
export declare const LAUNCH_HELP: string;
export declare function parseLaunchArgs(argv: string[], env: NodeJS.ProcessEnv): { shell: 'auto' | 'browser'; why: string; open: boolean; help: boolean; shellArgs: string[]; problems: string[] };
export declare function browserCommand(url: string, env: NodeJS.ProcessEnv, platform: NodeJS.Platform): { skip: string } | { skip?: undefined; command: string; args: string[]; options: SpawnOptions };
export declare function openBrowser(url: string, os: { env: NodeJS.ProcessEnv; platform: NodeJS.Platform; spawn: Spawn; log(line: string): void }): void;
export declare function findElectron(requireElectron: () => unknown, exists?: (path: string) => boolean): { binary: string; reason?: undefined } | { binary?: undefined; reason: string };
export declare function fetchElectron(options: { root: string; env: NodeJS.ProcessEnv; spawn: Spawn; stallMs?: number }): Promise<string | null>;
export declare function launch(argv: string[], os: LaunchSystem): Promise<void>;
