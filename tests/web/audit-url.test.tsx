import { edgeSearch } from '@/lib/api/audits';
import {
  activeFilterCount,
  boundFromText,
  changeFilters,
  defaultFilters,
  edgeQueryFromFilters,
  filtersFromParams,
  paramsFromFilters,
  pctFromShare,
  shareFromPct,
  toggleIn,
  toggleSort,
  type EdgeFilters,
} from '@/components/audits/edge-query-url';
import { ladderSteps, settingsFromForm, defaultStartForm } from '@/components/audits/start-audit-form';
import { edgeQuerySchema, responseClasses } from '@/lib/schemas/audit';

const defined = (o: Record<string, string | undefined>) => Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined));

describe('audit table filters ⇄ URL', () => {
  test('an empty URL gives the defaults, and the defaults write no keys at all', () => {
    expect(filtersFromParams({})).toEqual(defaultFilters);
    expect(defined(paramsFromFilters(defaultFilters))).toEqual({});
  });

  test('a shared link reads back to the same filters, and writes back to the same link', () => {
    const link = { class: 'square-root,cube-root', expMin: '0.3', expMax: '0.6', tolBelow: '0.01', disposition: 'none,monitor', flagged: 'yes', q: 'mast', sort: 'toleranceRel', dir: 'desc', page: '3', pageSize: '100' };
    const f = filtersFromParams(link);
    expect(f).toEqual({ classes: ['square-root', 'cube-root'], expMin: 0.3, expMax: 0.6, tolBelow: 0.01, dispositions: ['monitor', 'none'], flagged: 'yes', q: 'mast', sort: 'toleranceRel', dir: 'desc', page: 3, pageSize: 100 });
    expect(defined(paramsFromFilters(f))).toEqual({ ...link, disposition: 'monitor,none' });
    expect(filtersFromParams(defined(paramsFromFilters(f)))).toEqual(f);
  });

  test('junk in a hand-edited URL falls back to defaults instead of failing', () => {
    const f = filtersFromParams({ class: 'wobbly,linear,linear', expMin: 'abc', tolBelow: '-1', sort: 'colour', dir: 'sideways', page: '0', pageSize: '9000', flagged: 'maybe', disposition: 'shrug' });
    expect(f).toEqual({ ...defaultFilters, classes: ['linear'] });
  });

  test('repeated keys (?class=a&class=b) are read like a comma list', () => {
    expect(filtersFromParams({ class: ['cube-root', 'square-root'] }).classes).toEqual(['square-root', 'cube-root']);
  });

  test('what the URL holds is exactly what the server’s edge query accepts', () => {
    const f: EdgeFilters = { ...defaultFilters, classes: ['square-root'], expMax: 0.55, dispositions: ['none'], q: ' relay ', page: 2 };
    const q = edgeQueryFromFilters(f);
    const parsed = edgeQuerySchema.parse(Object.fromEntries(new URLSearchParams(edgeSearch(q))));
    expect(parsed).toEqual({ class: 'square-root', expMax: 0.55, disposition: 'none', q: 'relay', sort: 'edge', dir: 'asc', page: 2, pageSize: 50 });
    expect(edgeSearch(q, { paging: false })).not.toMatch(/page/);
  });

  test('changing a filter or the sort goes back to page 1; turning the page keeps the filters', () => {
    const on5 = { ...defaultFilters, classes: ['linear' as const], page: 5 };
    expect(changeFilters(on5, { q: 'buoy' }).page).toBe(1);
    expect(changeFilters(on5, { page: 6 })).toEqual({ ...on5, page: 6 });
    expect(toggleSort(on5, 'weight')).toMatchObject({ sort: 'weight', dir: 'asc', page: 1 });
    expect(toggleSort({ ...on5, sort: 'weight' }, 'weight').dir).toBe('desc');
    expect(toggleSort({ ...on5, sort: 'weight', dir: 'desc' }, 'weight').dir).toBe('asc');
  });

  test('multi-select keeps the canonical order and counts what narrows the table', () => {
    let c = toggleIn([], 'cube-root', responseClasses);
    c = toggleIn(c, 'linear', responseClasses);
    expect(c).toEqual(['linear', 'cube-root']);
    expect(toggleIn(c, 'linear', responseClasses)).toEqual(['cube-root']);
    expect(activeFilterCount({ ...defaultFilters, classes: c, expMin: 0.2, expMax: 0.8, sort: 'class', page: 4 })).toBe(2);
  });

  test('the tolerance filter is typed in per cent and kept as a share of the weight', () => {
    expect(shareFromPct('1')).toBe(0.01);
    expect(shareFromPct('0,5')).toBe(0.005);
    expect(shareFromPct('')).toBeUndefined();
    expect(shareFromPct('-2')).toBeUndefined();
    expect(pctFromShare(0.07)).toBe('7');
    expect(boundFromText('−0.5')).toBe(-0.5);
    expect(boundFromText('x')).toBeUndefined();
  });
});

describe('start form', () => {
  test('defaults come from the contract and pass its schema', () => {
    const f = defaultStartForm('in');
    expect(f).toMatchObject({ from: '2', to: '7', step: '0.5', signs: 'both', tolerancePct: '1' });
    const r = settingsFromForm(f);
    expect(r).toEqual({ ok: true, settings: { convention: 'in', ladder: { from: 2, to: 7, step: 0.5 }, signs: ['plus', 'minus'], tolerance: 0.01 } });
    expect(ladderSteps(2, 7, 0.5)).toBe(11);
  });

  test('refusals name the field in plain words', () => {
    const base = defaultStartForm('out');
    expect(settingsFromForm({ ...base, from: 'two' })).toEqual({ ok: false, errors: { from: 'a number, e.g. 2' } });
    expect(settingsFromForm({ ...base, from: '8', to: '7' })).toMatchObject({ ok: false, errors: { ladder: expect.stringMatching(/exceed/) } });
    expect(settingsFromForm({ ...base, step: '0.1', from: '0.5', to: '14' })).toMatchObject({ ok: false, errors: { ladder: expect.stringMatching(/40 steps/) } });
    expect(settingsFromForm({ ...base, tolerancePct: '80' })).toMatchObject({ ok: false, errors: { tolerance: expect.stringMatching(/50 per cent/) } });
    expect(settingsFromForm({ ...base, signs: 'minus' })).toMatchObject({ ok: true, settings: { signs: ['minus'] } });
  });
});
