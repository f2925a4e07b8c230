import { Text } from '../ui/text';

const look = {
  pending: { glyph: '◌', label: 'spectrum computing', cls: 'text-ochre' },
  ready: { glyph: '●', label: 'spectrum ready', cls: 'text-verdigris' },
  failed: { glyph: '×', label: 'spectrum failed', cls: 'text-rust' },
} as const;

export function SummaryStateTag({ state }: { state: keyof typeof look }) {
  const l = look[state];
  return (
    <Text className={`text-xs ${l.cls}`}>
      {l.glyph} {l.label}
    </Text>
  );
}
