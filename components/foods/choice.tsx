import { Pressable, StyleSheet, View } from 'react-native';
import { MIN_TOUCH } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Text } from '../ui/text';

export type ChoiceOption<T extends string> = { value: T; label: string; hint?: string };

/** A labelled set of mutually exclusive options (radio group); the chosen one is marked by a dot and border, not colour alone. */
export function Choice<T extends string>({ label, options, value, onChange }: { label: string; options: ChoiceOption<T>[]; value: T; onChange: (v: T) => void }) {
  const t = useTheme();
  return (
    <View style={styles.wrap} role="radiogroup" aria-label={label}>
      <Text variant="label">{label}</Text>
      <View style={styles.options}>
        {options.map((o) => {
          const on = o.value === value;
          return (
            <Pressable
              key={o.value}
              role="radio"
              aria-checked={on}
              aria-label={o.label}
              onPress={() => onChange(o.value)}
              style={[styles.option, { borderColor: on ? t.colors.primary : t.colors.border, backgroundColor: on ? t.colors.primarySoft : t.colors.surface }]}
            >
              <Text weight="bold">
                {on ? '◉ ' : '○ '}
                {o.label}
              </Text>
              {o.hint ? (
                <Text variant="caption" color="textMuted">
                  {o.hint}
                </Text>
              ) : null}
            </Pressable>
          );
        })}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: 6 },
  options: { flexDirection: 'row', flexWrap: 'wrap', gap: 8 },
  option: { borderWidth: 1.5, borderRadius: 10, paddingHorizontal: 14, paddingVertical: 8, minHeight: MIN_TOUCH, flexGrow: 1, flexBasis: 200, gap: 2 },
});
