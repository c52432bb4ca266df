// Compile-time guard of the core's layer: each line below must fail to compile. The core runs
// in the page, the service and the command line alike, so neither the DOM nor Node may be in
// its compilation; if one arrives, the unused @ts-expect-error fails the typecheck instead.

// @ts-expect-error the core has no DOM
export type CoreHasNoWindow = typeof window;
// @ts-expect-error the core has no Node globals
export type CoreHasNoProcess = typeof process;
