import { Pressable, View } from 'react-native';
import { Text } from '@/components/ui/text';
import { roles, type Role } from '@/lib/schemas/roles';

/** Four toggles; a held role shows ✓ and a filled chip, so state never rests on colour alone. */
export function RolePicker({ value, onChange, label }: { value: Role[]; onChange: (r: Role[]) => void; label: string }) {
  return (
    <View accessibilityLabel={label} className="flex-row flex-wrap gap-2">
      {roles.map((r) => {
        const on = value.includes(r);
        return (
          <Pressable
            key={r}
            accessibilityRole="checkbox"
            accessibilityLabel={`${label}: ${r}`}
            accessibilityState={{ checked: on }}
            onPress={() => onChange(on ? value.filter((x) => x !== r) : [...value, r])}
            className={`min-h-[36px] flex-row items-center rounded-full border px-3 ${on ? 'border-ink bg-ink' : 'border-rule-strong bg-paper-card'}`}
          >
            <Text className={`text-sm ${on ? 'text-paper-card' : 'text-ink-soft'}`}>{on ? `✓ ${r}` : r}</Text>
          </Pressable>
        );
      })}
    </View>
  );
}
