import { Pressable, StyleSheet, View } from 'react-native';
import { MIN_TOUCH } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Text } from '../ui/text';

/** A row of mutually exclusive choices (a radio group); the chosen one is marked with a tick and bold text too. */
export function ChoiceRow<T extends string>({
  label,
  options,
  value,
  onChange,
}: {
  label: string;
  options: { value: T; label: string }[];
  value: T;
  onChange: (value: T) => void;
}) {
  const t = useTheme();
  return (
    <View style={styles.wrap}>
      <Text variant="label">{label}</Text>
      <View role="radiogroup" aria-label={label} style={styles.row}>
        {options.map((o) => {
          const on = o.value === value;
          return (
            <Pressable
              key={o.value}
              role="radio"
              aria-checked={on}
              onPress={() => onChange(o.value)}
              style={[
                styles.chip,
                { borderColor: on ? t.colors.primary : t.colors.border, backgroundColor: on ? t.colors.primarySoft : t.colors.surface },
              ]}
            >
              <Text variant="label" color={on ? 'primary' : 'text'} weight={on ? 'bold' : 'regular'}>
                {on ? '✓ ' : ''}
                {o.label}
              </Text>
            </Pressable>
          );
        })}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: 6 },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: 8 },
  chip: { minHeight: MIN_TOUCH, paddingHorizontal: 14, borderWidth: 1.5, borderRadius: 10, justifyContent: 'center' },
});
