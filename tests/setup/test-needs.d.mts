export interface RunResult {
  status: number | null;
  error?: Error;
}
export interface TestSystem {
  env: NodeJS.ProcessEnv;
  platform: NodeJS.Platform;
  uid: number | null;
  osRelease: string;
  /** The one call that starts a process. */
  run(command: string, args: string[], options?: { quiet?: boolean; env?: NodeJS.ProcessEnv }): RunResult;
  log(line: string): void;
  error(text: string): void;
}
export interface Need {
  id: string;
  label: string;
  why: string;
  find(sys: TestSystem): { path: string | null; tried: string[] };
  packages: Record<string, string>;
  commands: Partial<Record<NodeJS.Platform, string>>;
  pointAt: string;
}
export declare const NEEDS: Need[];
export declare const SERVER_NEEDS: Need[];
export declare function findPgServer(env: NodeJS.ProcessEnv): { path: string | null; tried: string[] };
export declare function parseOsRelease(text: string): { id: string; like: string[] };
export declare function linuxFamily(osReleaseText: string): 'debian' | 'ubuntu' | 'fedora' | 'arch' | 'suse' | 'alpine' | null;
export declare function manualCommand(need: Need, sys: TestSystem): string | null;
export declare function installer(sys: TestSystem): { reason: string } | { family: 'debian' | 'ubuntu'; how: string; prefix: string[]; aptGet: string; reason?: undefined };
export declare function ensureTestNeeds(sys: TestSystem, needs?: Need[]): { ok: boolean };
export declare function realSystem(): TestSystem;
