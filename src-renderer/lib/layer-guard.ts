// Compile-time guard of the page's layer: each line below must fail to compile. If Node's
// globals ever reach the page's compilation (through a type package a declaration drags in),
// the expected error goes away and the unused @ts-expect-error fails the typecheck instead.

// @ts-expect-error the page runs without Node's `process`
export type PageHasNoProcess = typeof process;
// @ts-expect-error the page runs without Node's `Buffer`
export type PageHasNoBuffer = typeof Buffer;
