import type { ReactNode } from 'react';
import { View } from 'react-native';
import { Text } from '../ui/text';

export const cautionText =
  'These figures support a licensed engineer’s review; they do not replace it, nor the codes and standards that apply where the system is built and operated.';

export function Caution() {
  return (
    <CautionBox role="note" label="Caution" glyph="!">
      <Text className="text-sm leading-5 text-ink">{cautionText}</Text>
    </CautionBox>
  );
}

/** The caution look shared by the audit screens' notices: ochre frame, a glyph (decorative: the label names it), then the words. */
export function CautionBox({ role, label, glyph, children }: { role: 'alert' | 'note'; label: string; glyph: string; children: ReactNode }) {
  return (
    <View role={role} aria-label={label} className="flex-row gap-2 rounded-md border border-ochre bg-ochre-soft px-3 py-2">
      <Text aria-hidden className="font-mono text-sm text-ink">
        {glyph}
      </Text>
      <View className="flex-1 gap-1">{children}</View>
    </View>
  );
}
