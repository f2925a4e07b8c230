import { useEffect, useRef } from 'react';
import { View } from 'react-native';
import { Text } from '../ui/text';

export interface ShownProblem {
  code: string;
  message: string;
  line?: number;
  element?: string;
}

/** Every problem of a refused import, each with its place, so the file can be fixed in one pass. */
export function ImportProblems({ title, problems }: { title: string; problems: ShownProblem[] }) {
  const ref = useRef<View>(null);
  // On the web a View is a DOM element: bring the list into view when it appears.
  useEffect(() => {
    (ref.current as unknown as { scrollIntoView?: (o: object) => void } | null)?.scrollIntoView?.({ block: 'start' });
  }, [title, problems]);
  return (
    <View ref={ref} role="alert" aria-label="Import problems" className="gap-2 rounded-lg border border-rust bg-rust-soft p-4">
      <Text className="font-bold text-ink">× {title}</Text>
      {problems.length > 0 ? (
        <View className="gap-1.5">
          {problems.map((p, i) => (
            <View key={i} className="flex-row flex-wrap items-baseline gap-x-3 border-t border-rule pt-1.5">
              {/* The parser's messages already begin with their place (line, element). */}
              <Text className="flex-1 text-sm leading-5 text-ink">{p.message}</Text>
              <Text className="font-mono text-[11px] text-ink-faint">{p.code}</Text>
            </View>
          ))}
        </View>
      ) : null}
      <Text className="text-xs text-ink-soft">Nothing was stored. Fix the file and import it again.</Text>
    </View>
  );
}
