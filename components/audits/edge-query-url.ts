import {
  dispositionKinds,
  edgeSortKeys,
  responseClasses,
  type DispositionKind,
  type EdgeQuery,
  type ResponseClass,
} from '@/lib/schemas/audit';

/**
 * The audit table's filters, sort and page as the URL carries them — the same
 * keys the server's edge query takes, so a shared link shows the same rows.
 * Both directions are pure and tolerant: a hand-edited URL with junk in it
 * falls back to the defaults rather than failing.
 */

export type EdgeSortKey = (typeof edgeSortKeys)[number];
export type DispositionFilter = DispositionKind | 'none';
export const dispositionFilters: readonly DispositionFilter[] = [...dispositionKinds, 'none'];
export const pageSizes = [25, 50, 100, 200] as const;

export interface EdgeFilters {
  classes: ResponseClass[];
  expMin?: number;
  expMax?: number;
  /** Relative tolerance (share of the weight), as the server takes it. */
  tolBelow?: number;
  dispositions: DispositionFilter[];
  flagged?: 'yes' | 'no';
  q: string;
  sort: EdgeSortKey;
  dir: 'asc' | 'desc';
  page: number;
  pageSize: number;
}

export const defaultFilters: EdgeFilters = { classes: [], dispositions: [], q: '', sort: 'edge', dir: 'asc', page: 1, pageSize: 50 };

/** The URL keys this mapping owns (others, like the selected edge, are left alone). */
export const filterKeys = ['class', 'expMin', 'expMax', 'tolBelow', 'disposition', 'flagged', 'q', 'sort', 'dir', 'page', 'pageSize'] as const;

type Params = Record<string, string | string[] | undefined>;

const one = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);

function num(v: string | string[] | undefined): number | undefined {
  const s = one(v)?.trim();
  if (!s) return undefined;
  const n = Number(s);
  return Number.isFinite(n) ? n : undefined;
}

/** Comma lists, keeping only known members, in their canonical order, once each. */
function list<T extends string>(v: string | string[] | undefined, known: readonly T[]): T[] {
  const raw = (Array.isArray(v) ? v.join(',') : (v ?? '')).split(',').map((s) => s.trim());
  return known.filter((k) => raw.includes(k));
}

export function filtersFromParams(p: Params): EdgeFilters {
  const sort = one(p.sort);
  const dir = one(p.dir);
  const flagged = one(p.flagged);
  const page = num(p.page);
  const size = num(p.pageSize);
  const tol = num(p.tolBelow);
  return {
    classes: list(p.class, responseClasses),
    expMin: num(p.expMin),
    expMax: num(p.expMax),
    tolBelow: tol !== undefined && tol > 0 ? tol : undefined,
    dispositions: list(p.disposition, dispositionFilters),
    flagged: flagged === 'yes' || flagged === 'no' ? flagged : undefined,
    q: (one(p.q) ?? '').slice(0, 200),
    sort: (edgeSortKeys as readonly string[]).includes(sort ?? '') ? (sort as EdgeSortKey) : 'edge',
    dir: dir === 'desc' ? 'desc' : 'asc',
    page: page !== undefined && Number.isInteger(page) && page >= 1 ? page : 1,
    pageSize: size !== undefined && Number.isInteger(size) && size >= 1 && size <= 500 ? size : 50,
  };
}

/**
 * Every owned key, with `undefined` for a default or empty value, so that
 * `router.setParams` clears what is no longer set and the URL stays short.
 */
export function paramsFromFilters(f: EdgeFilters): Record<(typeof filterKeys)[number], string | undefined> {
  const s = (n: number | undefined) => (n === undefined ? undefined : String(n));
  return {
    class: f.classes.length ? f.classes.join(',') : undefined,
    expMin: s(f.expMin),
    expMax: s(f.expMax),
    tolBelow: s(f.tolBelow),
    disposition: f.dispositions.length ? f.dispositions.join(',') : undefined,
    flagged: f.flagged,
    q: f.q.trim() ? f.q.trim() : undefined,
    sort: f.sort === 'edge' ? undefined : f.sort,
    dir: f.dir === 'asc' ? undefined : f.dir,
    page: f.page === 1 ? undefined : String(f.page),
    pageSize: f.pageSize === 50 ? undefined : String(f.pageSize),
  };
}

/** The server's edge query for these filters. */
export function edgeQueryFromFilters(f: EdgeFilters): EdgeQuery {
  const p = paramsFromFilters(f);
  return {
    class: p.class,
    expMin: f.expMin,
    expMax: f.expMax,
    tolBelow: f.tolBelow,
    disposition: p.disposition,
    flagged: f.flagged,
    q: p.q,
    sort: f.sort,
    dir: f.dir,
    page: f.page,
    pageSize: f.pageSize,
  };
}

/** A change of filter or sort goes back to page 1; a change of page keeps the rest. */
export function changeFilters(f: EdgeFilters, patch: Partial<EdgeFilters>): EdgeFilters {
  const onlyPaging = Object.keys(patch).every((k) => k === 'page');
  return { ...f, ...patch, page: onlyPaging ? (patch.page ?? f.page) : 1 };
}

/** Clicking a column: a new column sorts ascending, the same column flips direction. */
export function toggleSort(f: EdgeFilters, key: EdgeSortKey): EdgeFilters {
  return changeFilters(f, { sort: key, dir: f.sort === key && f.dir === 'asc' ? 'desc' : 'asc' });
}

export function toggleIn<T>(items: readonly T[], item: T, order: readonly T[]): T[] {
  const next = items.includes(item) ? items.filter((i) => i !== item) : [...items, item];
  return order.filter((o) => next.includes(o));
}

/** How many filters narrow the table (sort and paging excluded). */
export function activeFilterCount(f: EdgeFilters): number {
  return [f.classes.length > 0, f.expMin !== undefined || f.expMax !== undefined, f.tolBelow !== undefined, f.dispositions.length > 0, !!f.flagged, !!f.q.trim()].filter(Boolean).length;
}

/** The filters of the audit table that show the flagged edges still lacking a disposition. */
export const undisposedFilters: EdgeFilters = { ...defaultFilters, flagged: 'yes', dispositions: ['none'] };

/** The tolerance filter is typed in per cent of the weight and kept as a share. */
export const pctFromShare = (share: number | undefined) => (share === undefined ? '' : String(+(share * 100).toPrecision(6)));
export function shareFromPct(text: string): number | undefined {
  const n = Number(text.trim().replace(',', '.'));
  return text.trim() !== '' && Number.isFinite(n) && n > 0 ? +(n / 100).toPrecision(12) : undefined;
}
/** A typed exponent bound: empty or unreadable means no bound. */
export function boundFromText(text: string): number | undefined {
  const n = Number(text.trim().replace(',', '.').replace('−', '-'));
  return text.trim() !== '' && Number.isFinite(n) ? n : undefined;
}
