import { partUsage } from '../../store/repositories/inventory';
import { defineHandler } from '../define-handler';
import { oneOf, record } from '../schemas/field-builders';

const INVENTORY_TABLES = ['batteries', 'motors', 'controllers', 'propellers', 'vehicles'] as const;

/** Per part of one kind: how many builds in use use it, and when one last had a logged current. */
export const inventoryUsage = defineHandler(record({ table: oneOf(INVENTORY_TABLES) }), async (ctx, input) => partUsage(ctx.db, input.table));
