import { BATTERY_FIELDS } from '$core/catalogue/battery-fields';
import type { Battery, Build, Controller, Motor, Propeller, Vehicle } from '$core/domain';
import { fieldLabel as engineWords } from '$core/field-labels';
import type { UnitSystem } from '$core/units';
import { BUILD_FIELD_LIST } from '../builds/build-fields';
import { fieldLabel } from '../forms/draft';
import { PART_FIELDS } from '../parts/part-fields';
import { formatRoute, type Route } from '../router/routes';

// The one place where the engine's field paths (`vehicle.dragAreaM2`, `gearing.pinionTeeth`)
// become what a user reads: the field's label as its form shows it, the record it belongs
// to, and a link that opens that form at that field. Paths never reach the screen.

export interface MissingInput {
  /** "Drag area Cd·A (m²)", as the form labels it; the engine's words where no form field fits. */
  label: string;
  /** "the vehicle “Test truck”", "this build". */
  where: string;
  /** Address of the form holding the field, or null where there is nothing to fill in. */
  href: string | null;
  /** The form field's key, to focus when the form opens. */
  field: string | null;
}

export interface SheetParts {
  build: Build;
  vehicle: Vehicle | null;
  motor: Motor | null;
  controller: Controller | null;
  propeller: Propeller | null;
  batteries: readonly Battery[];
}

const PART_OF: Readonly<Record<string, { table: 'vehicles' | 'motors' | 'controllers' | 'propellers' | 'batteries'; one: string }>> = {
  vehicle: { table: 'vehicles', one: 'vehicle' },
  motor: { table: 'motors', one: 'motor' },
  controller: { table: 'controllers', one: 'speed controller' },
  propeller: { table: 'propellers', one: 'propeller' },
  battery: { table: 'batteries', one: 'pack' },
};

/** A pack field the catalogue lists, so the pack that lacks it can be found. */
const isBatteryField = (key: string): key is keyof typeof BATTERY_FIELDS => Object.hasOwn(BATTERY_FIELDS, key);

function routeOf(table: 'vehicles' | 'motors' | 'controllers' | 'propellers' | 'batteries', id: string): Route {
  if (table === 'vehicles') return { name: 'vehicles', id };
  return { name: 'parts', slug: table === 'batteries' ? 'packs' : table, id };
}

/** One missing input of a finding, for the supply with these packs. */
export function missingInput(path: string, sheet: SheetParts, batteryIds: readonly string[], system: UnitSystem): MissingInput {
  const [head = '', key = ''] = path.split('.');
  const words = engineWords(path);
  const plain = (where: string): MissingInput => ({ label: words === path ? 'an input Rigbook needs' : words, where, href: null, field: null });
  const part = PART_OF[head];
  if (part) {
    const def = PART_FIELDS[part.table].find((f) => f.key === key);
    let record: { id: string; name: string } | null = null;
    if (head === 'battery') {
      const packs = sheet.batteries.filter((b) => batteryIds.includes(b.id));
      record = packs.find((b) => isBatteryField(key) && b[key] === null) ?? packs[0] ?? null;
    } else record = sheet[head as 'vehicle' | 'motor' | 'controller' | 'propeller'];
    if (!record) return plain(`the build's ${part.one}`);
    return {
      label: def ? fieldLabel(def, system) : words,
      where: `the ${part.one} “${record.name}”`,
      href: formatRoute(routeOf(part.table, record.id)),
      field: def ? def.key : null,
    };
  }
  if (head === 'gearing' || head === 'build' || head === 'supply') {
    const formKey = head === 'gearing' ? path : head === 'supply' ? 'supplies' : key === 'supplies' ? 'supplies' : key;
    const def = BUILD_FIELD_LIST.find((f) => f.key === formKey);
    return {
      label: def ? fieldLabel(def, system) : formKey === 'supplies' ? 'Supplies (packs that exist in the records)' : words,
      where: 'this build',
      href: formatRoute({ name: 'build-edit', id: sheet.build.id }),
      field: def ? def.key : formKey === 'supplies' ? 'supplies' : null,
    };
  }
  if (head === 'classRule') return plain(`the class rules of “${sheet.vehicle?.className ?? ''}”`);
  return plain('');
}

export function missingInputs(paths: readonly string[] | undefined, sheet: SheetParts, batteryIds: readonly string[], system: UnitSystem): MissingInput[] {
  const seen = new Set<string>();
  const out: MissingInput[] = [];
  for (const p of paths ?? []) {
    const m = missingInput(p, sheet, batteryIds, system);
    const k = `${m.label}|${m.where}`;
    if (!seen.has(k)) {
      seen.add(k);
      out.push(m);
    }
  }
  return out;
}
