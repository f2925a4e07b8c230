import { useEffect, useRef, useState } from 'react';
import { View } from 'react-native';
import { edgeSortKeys, responseClasses } from '@/lib/schemas/audit';
import { Button } from '../ui/button';
import { Choice } from '../ui/choice';
import { Field } from '../ui/field';
import { Text } from '../ui/text';
import {
  activeFilterCount,
  boundFromText,
  changeFilters,
  defaultFilters,
  dispositionFilters,
  pctFromShare,
  shareFromPct,
  toggleIn,
  type EdgeFilters,
} from './edge-query-url';
import { classLook, dispositionLook, sortLabels } from './looks';
import { ChipRow, ToggleChip } from './toggle-chip';

/** A text box that hands its value on once typing pauses, and follows outside changes. */
function useTyped(outside: string, commit: (text: string) => void, delay = 350) {
  const [text, setText] = useState(outside);
  const last = useRef(outside);
  const latest = useRef(commit);
  latest.current = commit;
  useEffect(() => {
    if (outside !== last.current) {
      last.current = outside;
      setText(outside);
    }
  }, [outside]);
  useEffect(() => {
    if (text === last.current) return;
    const t = setTimeout(() => {
      last.current = text;
      latest.current(text);
    }, delay);
    return () => clearTimeout(t);
  }, [text, delay]);
  return [text, setText] as const;
}

export function EdgeFiltersPanel({ filters, onChange, total }: { filters: EdgeFilters; onChange: (f: EdgeFilters) => void; total?: number }) {
  const change = (patch: Partial<EdgeFilters>) => onChange(changeFilters(filters, patch));
  const [q, setQ] = useTyped(filters.q, (t) => change({ q: t }));
  const [lo, setLo] = useTyped(filters.expMin === undefined ? '' : String(filters.expMin), (t) => change({ expMin: boundFromText(t) }));
  const [hi, setHi] = useTyped(filters.expMax === undefined ? '' : String(filters.expMax), (t) => change({ expMax: boundFromText(t) }));
  const [tol, setTol] = useTyped(pctFromShare(filters.tolBelow), (t) => change({ tolBelow: shareFromPct(t) }));
  const active = activeFilterCount(filters);
  // On a phone the controls fold away behind one button; from 1024 px they always show.
  const [open, setOpen] = useState(false);

  return (
    <View className="gap-3">
      <View role="form" aria-label="Filter edges" className={`gap-3 ${open ? 'flex' : 'hidden'} lg:flex`}>
        <ChipRow label="Class (worse of the two signs)">
          {responseClasses.map((c) => (
            <ToggleChip key={c} label={classLook[c].label} glyph={classLook[c].glyph} on={filters.classes.includes(c)} onPress={() => change({ classes: toggleIn(filters.classes, c, responseClasses) })} />
          ))}
        </ChipRow>
        <ChipRow label="Disposition">
          <ToggleChip label="flagged only" glyph="⚑" on={filters.flagged === 'yes'} onPress={() => change({ flagged: filters.flagged === 'yes' ? undefined : 'yes' })} />
          {dispositionFilters.map((d) => (
            <ToggleChip key={d} label={dispositionLook[d].label} glyph={dispositionLook[d].glyph} on={filters.dispositions.includes(d)} onPress={() => change({ dispositions: toggleIn(filters.dispositions, d, dispositionFilters) })} />
          ))}
        </ChipRow>
        <View className="flex-row flex-wrap gap-3">
          <View className="min-w-[180px] flex-[2]">
            <Field label="Node name" placeholder="source or target contains…" value={q} onChangeText={setQ} autoCapitalize="none" autoCorrect={false} />
          </View>
          <View className="min-w-[88px] flex-1">
            <Field label="Exponent from" mono keyboardType="decimal-pad" placeholder="0.3" value={lo} onChangeText={setLo} />
          </View>
          <View className="min-w-[88px] flex-1">
            <Field label="Exponent to" mono keyboardType="decimal-pad" placeholder="0.6" value={hi} onChangeText={setHi} />
          </View>
          <View className="min-w-[176px] flex-1">
            <Field label="Tolerance below (% of w)" mono keyboardType="decimal-pad" placeholder="1" value={tol} onChangeText={setTol} />
          </View>
        </View>
        <View className="gap-2 lg:hidden">
          <Choice label="Sort by" value={filters.sort} options={edgeSortKeys.map((k) => ({ value: k, label: sortLabels[k] }))} onChange={(k) => change({ sort: k })} />
          <View className="self-start">
            <Button tone="secondary" label={filters.dir === 'asc' ? '▲ Ascending' : '▼ Descending'} accessibilityHint="Reverses the order" onPress={() => change({ dir: filters.dir === 'asc' ? 'desc' : 'asc' })} />
          </View>
        </View>
      </View>
      <View className="flex-row flex-wrap items-center gap-3">
        <View className="lg:hidden">
          <Button label={open ? 'Hide filters and sort' : 'Filters and sort'} tone="secondary" onPress={() => setOpen(!open)} />
        </View>
        <Text className="font-mono text-sm text-ink-soft">
          {total === undefined ? '…' : `${total} edge${total === 1 ? '' : 's'}`} {active ? `· ${active} filter${active === 1 ? '' : 's'} on` : '· no filter'}
        </Text>
        {active ? <Button label="Clear filters" tone="quiet" onPress={() => onChange({ ...defaultFilters, sort: filters.sort, dir: filters.dir, pageSize: filters.pageSize })} /> : null}
      </View>
    </View>
  );
}
