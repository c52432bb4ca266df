// Compile-time check, run by `npm run typecheck`: the store's table types and the field
// catalogues name the same columns, each nullable or not alike. A field added to a catalogue
// with a table type written by hand, or a column made nullable on one side only, fails the build
// here (tests/store/catalogue-columns.test.ts checks the migrated database the same way).

import type { BATTERY_FIELDS } from '../../src-main/core/catalogue/battery-fields';
import type { BUILD_FIELDS, GEARING_FIELDS } from '../../src-main/core/catalogue/build-fields';
import type { CONTROLLER_FIELDS } from '../../src-main/core/catalogue/controller-fields';
import type { MOTOR_FIELDS } from '../../src-main/core/catalogue/motor-fields';
import type { PROPELLER_FIELDS } from '../../src-main/core/catalogue/propeller-fields';
import type { VEHICLE_FIELDS } from '../../src-main/core/catalogue/vehicle-fields';
import type { RecordMeta } from '../../src-main/core/domain';
import type { Db } from '../../src-main/store/schema';

/** True only when A and B are the same type (not merely assignable either way). */
type Equal<A, B> = (<T>() => T extends A ? 1 : 2) extends <T>() => T extends B ? 1 : 2 ? true : false;
type Expect<T extends true> = T;

type Flat<T> = { [K in keyof T]: T[K] };
type Bookkeeping = keyof RecordMeta | 'createdAt' | 'updatedAt';

/** Each column of a table, bookkeeping aside: may it hold null? */
type StoreColumns<T> = Flat<{ -readonly [K in Exclude<keyof T, Bookkeeping>]-?: null extends T[K] ? 'null' : 'not null' }>;

/** Each field of a catalogue stored in its table, with what its catalogue says about null. */
type CatalogueColumns<C> = {
  -readonly [K in keyof C as K extends Bookkeeping ? never : C[K] extends { type: 'group' | 'supplies' } ? never : K]-?: C[K] extends { nullable: true } ? 'null' : 'not null';
};

export type CatalogueMatchesStore = [
  Expect<Equal<StoreColumns<Db['batteries']>, CatalogueColumns<typeof BATTERY_FIELDS>>>,
  Expect<Equal<StoreColumns<Db['motors']>, CatalogueColumns<typeof MOTOR_FIELDS>>>,
  Expect<Equal<StoreColumns<Db['controllers']>, CatalogueColumns<typeof CONTROLLER_FIELDS>>>,
  Expect<Equal<StoreColumns<Db['propellers']>, CatalogueColumns<typeof PROPELLER_FIELDS>>>,
  Expect<Equal<StoreColumns<Db['vehicles']>, CatalogueColumns<typeof VEHICLE_FIELDS>>>,
  Expect<Equal<StoreColumns<Db['builds']>, Flat<CatalogueColumns<typeof BUILD_FIELDS> & CatalogueColumns<typeof GEARING_FIELDS>>>>,
];
