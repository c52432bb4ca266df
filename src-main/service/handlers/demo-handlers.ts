import * as v from 'valibot';
import { ServiceError } from '../contract';
import { defineHandler } from '../define-handler';
import { importFleet } from '../fleet/import-fleet';
import { flag, record } from '../schemas/field-builders';
import { progressEvents } from './fleet-handlers';

/**
 * Loads the invented demo fleet. It refuses a store that already holds records, so invented
 * builds never mix with a shop's own, unless asked to merge. The fleet comes from the shell
 * (`ctx.demoFleet`), so the service itself carries no fixture data.
 */
export const loadDemoHandler = defineHandler(v.optional(record({ merge: v.optional(flag(), false) }), {}), async (ctx, input) => {
  if (!ctx.demoFleet) throw new ServiceError('not-found', 'This copy of Rigbook offers no demo fleet.');
  return importFleet(ctx, ctx.demoFleet(), {
    mode: 'merge',
    source: 'demo',
    reason: 'demo fleet',
    requireEmptyStore: !input.merge,
    onProgress: progressEvents(ctx, 'fleet'),
  });
});
