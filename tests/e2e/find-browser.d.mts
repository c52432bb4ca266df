export declare const CHROMIUM_FLAGS: string[];
export declare function onPath(name: string, env?: NodeJS.ProcessEnv, platform?: NodeJS.Platform): string | null;
export declare function findBrowser(env?: NodeJS.ProcessEnv, platform?: NodeJS.Platform): { path: string | null; tried: string[] };
