import type { PartSlug } from '../router/routes';

export type PartTable = 'batteries' | 'motors' | 'controllers' | 'propellers' | 'vehicles';

export interface PartKindInfo {
  table: PartTable;
  /** One record, as a person says it. */
  one: string;
  /** Many records, for headings and tabs. */
  many: string;
}

export const PART_KINDS: Readonly<Record<PartTable, PartKindInfo>> = {
  batteries: { table: 'batteries', one: 'pack', many: 'Packs' },
  motors: { table: 'motors', one: 'motor', many: 'Motors' },
  controllers: { table: 'controllers', one: 'speed controller', many: 'Speed controllers' },
  propellers: { table: 'propellers', one: 'propeller', many: 'Propellers' },
  vehicles: { table: 'vehicles', one: 'vehicle', many: 'Vehicles' },
};

export const SLUG_OF_TABLE: Readonly<Partial<Record<PartTable, PartSlug>>> = {
  batteries: 'packs',
  motors: 'motors',
  controllers: 'controllers',
  propellers: 'propellers',
};
