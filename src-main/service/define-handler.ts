import type * as v from 'valibot';
import type { ServiceContext } from './service-context';

/** A handler: the schema its one argument must pass, and the work it does with the parsed value. */
export interface Handler<S extends v.GenericSchema, R> {
  input: S;
  // Method syntax keeps the map assignable to one record type while each handler keeps its own input type.
  run(ctx: ServiceContext, input: v.InferOutput<S>): Promise<R>;
}

export function defineHandler<S extends v.GenericSchema, R>(input: S, run: (ctx: ServiceContext, input: v.InferOutput<S>) => Promise<R>): Handler<S, R> {
  return { input, run };
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export type AnyHandler = Handler<v.GenericSchema, any>;
