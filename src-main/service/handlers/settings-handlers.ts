import * as v from 'valibot';
import { readSettings, writeSettings, type Settings } from '../../store/repositories/settings';
import { defineHandler } from '../define-handler';
import { runWrite } from '../run-write';
import { flag, number, oneOf, record } from '../schemas/field-builders';
import { NUMBER_LOCALE_TAGS } from '../../core/number-text';

export const getSettings = defineHandler(v.optional(record({}), {}), async (ctx) => readSettings(ctx.db));

export const updateSettings = defineHandler(
  record({
    units: v.optional(oneOf(['metric', 'imperial'] as const)),
    numberLocale: v.optional(oneOf(NUMBER_LOCALE_TAGS)),
    tightThreshold: v.optional(number({ min: 0, max: 0.9 })),
    demoOffered: v.optional(flag()),
  }),
  async (ctx, input) => {
    const outcome = await runWrite(ctx, async (trx) => {
      const before = await readSettings(trx);
      await writeSettings(trx, input);
      const after: Settings = await readSettings(trx);
      // Only the default threshold changes verdicts; it applies to every build that sets none.
      const thresholdChanged = before.tightThreshold !== after.tightThreshold;
      return {
        result: after,
        history: thresholdChanged ? { action: 'update', entityKind: 'settings', entityId: 'tightThreshold', summary: `Default tight threshold ${before.tightThreshold} → ${after.tightThreshold}`, reason: '', before, after } : null,
        recheck: thresholdChanged ? { by: 'all' } : [],
        changed: { kind: 'settings', ids: Object.keys(input) },
      };
    });
    return outcome.result;
  },
);
