// Hash routes: the screen lives in the address, so a reload (or a bookmark) opens it again.
import { formatListQuery, isDefaultListQuery, parseListQuery, type ListQuery } from '../builds/list-query';

export const PART_SLUGS = ['packs', 'motors', 'controllers', 'propellers'] as const;
export type PartSlug = (typeof PART_SLUGS)[number];

export const HISTORY_KINDS = ['builds', 'batteries', 'motors', 'controllers', 'propellers', 'vehicles'] as const;
export type HistoryKind = (typeof HISTORY_KINDS)[number];

export type Route =
  | { name: 'builds'; query?: ListQuery }
  | { name: 'build-new'; vehicleId?: string }
  | { name: 'build'; id: string }
  | { name: 'build-edit'; id: string }
  | { name: 'build-swap'; id: string }
  | { name: 'compare'; ids: string[]; of?: CompareOf }
  | { name: 'parts'; slug: PartSlug; id: string | null }
  | { name: 'vehicles'; id: string | null }
  | { name: 'classes'; id: string | null }
  | { name: 'history'; kind: HistoryKind | null; id: string | null }
  | { name: 'settings' }
  | { name: 'customers'; id: string | null }
  | { name: 'work-order'; id: string }
  | { name: 'work-order-new'; vehicleId: string | null };

/**
 * What a comparison of one build sets side by side: its supplies, or the build as it is and with
 * a change (`change` is the `builds.preview` request as JSON, so a reload previews it afresh).
 */
export type CompareOf = { supplies: true } | { change: string; title: string };

export type Tab = 'builds' | 'parts' | 'vehicles' | 'classes' | 'history' | 'settings' | 'customers';

const isPartSlug = (s: string | undefined): s is PartSlug => (PART_SLUGS as readonly string[]).includes(s ?? '');
const isHistoryKind = (s: string | undefined): s is HistoryKind => (HISTORY_KINDS as readonly string[]).includes(s ?? '');

function decode(segment: string | undefined): string | null {
  if (segment === undefined || segment === '') return null;
  try {
    return decodeURIComponent(segment);
  } catch {
    return null;
  }
}

/** The builds a comparison names (`ids=a,b,c`), each once, in the order given. */
function compareIds(search: string): string[] {
  // Read by hand: each id is escaped on its own, so a comma inside one stays part of it.
  const raw =
    search
      .split('&')
      .find((p) => p.startsWith('ids='))
      ?.slice(4) ?? '';
  return [
    ...new Set(
      raw
        .split(',')
        .map((s) => decode(s.trim()))
        .filter((s): s is string => s !== null),
    ),
  ];
}

/** Reads `#/builds/abc` into a route; anything unknown opens the builds list. */
export function parseRoute(hash: string): Route {
  const [path = '', search = ''] = hash.replace(/^#\/?/, '').split('?');
  const [head, a, b] = path.split('/');
  switch (head) {
    case 'builds': {
      if (a === 'new') {
        const vehicleId = new URLSearchParams(search).get('vehicle');
        return vehicleId ? { name: 'build-new', vehicleId } : { name: 'build-new' };
      }
      const id = decode(a);
      if (id === null) {
        const query = parseListQuery(search);
        return isDefaultListQuery(query) ? { name: 'builds' } : { name: 'builds', query };
      }
      if (b === 'edit') return { name: 'build-edit', id };
      if (b === 'swap') return { name: 'build-swap', id };
      return { name: 'build', id };
    }
    case 'parts':
      return { name: 'parts', slug: isPartSlug(a) ? a : 'packs', id: isPartSlug(a) ? decode(b) : null };
    case 'vehicles':
      return { name: 'vehicles', id: decode(a) };
    case 'classes':
      return { name: 'classes', id: decode(a) };
    case 'history':
      return isHistoryKind(a) && decode(b) !== null ? { name: 'history', kind: a, id: decode(b) } : { name: 'history', kind: null, id: null };
    case 'settings':
      return { name: 'settings' };
    case 'customers':
      return { name: 'customers', id: decode(a) };
    case 'jobs': {
      if (a === 'new') return { name: 'work-order-new', vehicleId: new URLSearchParams(search).get('vehicle') };
      const id = decode(a);
      return id === null ? { name: 'customers', id: null } : { name: 'work-order', id };
    }
    case 'compare': {
      const ids = compareIds(search);
      const params = new URLSearchParams(search);
      const change = params.get('change');
      if (params.get('supplies') === '1') return { name: 'compare', ids: ids.slice(0, 1), of: { supplies: true } };
      if (change !== null) return { name: 'compare', ids: ids.slice(0, 1), of: { change, title: params.get('title') ?? '' } };
      return { name: 'compare', ids };
    }
    default:
      return { name: 'builds' };
  }
}

const enc = encodeURIComponent;

export function formatRoute(route: Route): string {
  switch (route.name) {
    case 'builds': {
      const search = route.query ? formatListQuery(route.query) : '';
      return search === '' ? '#/builds' : `#/builds?${search}`;
    }
    case 'build-new':
      return route.vehicleId ? `#/builds/new?${new URLSearchParams({ vehicle: route.vehicleId }).toString()}` : '#/builds/new';
    case 'build':
      return `#/builds/${enc(route.id)}`;
    case 'build-edit':
      return `#/builds/${enc(route.id)}/edit`;
    case 'build-swap':
      return `#/builds/${enc(route.id)}/swap`;
    case 'parts':
      return route.id === null ? `#/parts/${route.slug}` : `#/parts/${route.slug}/${enc(route.id)}`;
    case 'vehicles':
      return route.id === null ? '#/vehicles' : `#/vehicles/${enc(route.id)}`;
    case 'classes':
      return route.id === null ? '#/classes' : `#/classes/${enc(route.id)}`;
    case 'history':
      return route.kind !== null && route.id !== null ? `#/history/${route.kind}/${enc(route.id)}` : '#/history';
    case 'settings':
      return '#/settings';
    case 'customers':
      return route.id === null ? '#/customers' : `#/customers/${enc(route.id)}`;
    case 'work-order':
      return `#/jobs/${enc(route.id)}`;
    case 'work-order-new':
      return route.vehicleId ? `#/jobs/new?${new URLSearchParams({ vehicle: route.vehicleId }).toString()}` : '#/jobs/new';
    case 'compare': {
      const base = `#/compare?ids=${route.ids.map(enc).join(',')}`;
      if (!route.of) return base;
      return 'supplies' in route.of ? `${base}&supplies=1` : `${base}&${new URLSearchParams({ change: route.of.change, title: route.of.title }).toString()}`;
    }
  }
}

export function tabOf(route: Route): Tab {
  switch (route.name) {
    case 'builds':
    case 'build-new':
    case 'build':
    case 'build-edit':
    case 'build-swap':
    case 'compare':
      return 'builds';
    case 'work-order':
    case 'work-order-new':
      return 'customers';
    default:
      return route.name;
  }
}

export const href = formatRoute;
