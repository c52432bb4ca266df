export declare const CHROMIUM_FLAGS: string[];
export declare function findBrowser(env?: NodeJS.ProcessEnv): { path: string | null; tried: string[] };
