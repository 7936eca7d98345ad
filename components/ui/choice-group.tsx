import { Pressable, StyleSheet, View } from 'react-native';
import { MIN_TOUCH } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { FieldMessage } from './field-message';
import { Text } from './text';

export type Choice<T> = { value: T; label: string; hint?: string };

export type ChoiceGroupProps<T> = {
  label: string;
  choices: readonly Choice<T>[];
  value: T | null | undefined;
  onChange: (value: T) => void;
  hint?: string;
  error?: string;
};

/**
 * A labelled set of mutually exclusive choices (a radio group). The chosen one is marked with a tick,
 * bold text and a border as well as colour, so it never relies on colour alone.
 */
export function ChoiceGroup<T extends string | number | boolean>({ label, choices, value, onChange, hint, error }: ChoiceGroupProps<T>) {
  const t = useTheme();
  return (
    <View style={styles.wrap}>
      <Text variant="label">{label}</Text>
      <View role="radiogroup" aria-label={label} style={styles.row}>
        {choices.map((c) => {
          const on = c.value === value;
          return (
            <Pressable
              key={String(c.value)}
              role="radio"
              aria-checked={on}
              aria-label={c.label}
              onPress={() => onChange(c.value)}
              style={[
                styles.chip,
                c.hint ? styles.withHint : null,
                { borderColor: on ? t.colors.primary : t.colors.border, backgroundColor: on ? t.colors.primarySoft : t.colors.surface },
              ]}
            >
              <Text variant="label" color={on ? 'primary' : 'text'} weight={on ? 'bold' : 'regular'}>
                {on ? '✓ ' : ''}
                {c.label}
              </Text>
              {c.hint ? (
                <Text variant="caption" color="textMuted">
                  {c.hint}
                </Text>
              ) : null}
            </Pressable>
          );
        })}
      </View>
      <FieldMessage hint={hint} error={error} />
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: 6 },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: 8 },
  // maxWidth lets a long choice wrap inside a phone-wide row instead of running past the edge.
  chip: { minHeight: MIN_TOUCH, maxWidth: '100%', paddingHorizontal: 14, paddingVertical: 6, borderWidth: 1.5, borderRadius: 10, justifyContent: 'center' },
  withHint: { flexGrow: 1, flexBasis: 200, gap: 2 },
});
