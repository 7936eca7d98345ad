import { StyleSheet, View } from 'react-native';
import { Button } from '../ui/button';
import { Text } from '../ui/text';

export type Choice<T> = { value: T; label: string };

/** A labelled row of buttons where one is chosen; the choice is announced, not shown by colour alone. */
export function ChoiceGroup<T extends string | number | boolean>({
  label,
  choices,
  value,
  onChange,
  error,
  hint,
}: {
  label: string;
  choices: readonly Choice<T>[];
  value: T | null | undefined;
  onChange: (value: T) => void;
  error?: string;
  hint?: string;
}) {
  return (
    <View style={styles.wrap} role="radiogroup" aria-label={label}>
      <Text variant="label">{label}</Text>
      <View style={styles.row}>
        {choices.map((c) => {
          const selected = c.value === value;
          return (
            <Button
              key={String(c.value)}
              role="radio"
              aria-checked={selected}
              accessibilityState={{ checked: selected }}
              variant={selected ? 'primary' : 'secondary'}
              label={selected ? `✓ ${c.label}` : c.label}
              onPress={() => onChange(c.value)}
            />
          );
        })}
      </View>
      {hint && !error ? (
        <Text variant="caption" color="textMuted">
          {hint}
        </Text>
      ) : null}
      {error ? (
        <Text variant="caption" color="danger" role="alert">
          {error}
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: 6 },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: 8 },
});
