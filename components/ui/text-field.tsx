import { forwardRef, useId } from 'react';
import { StyleSheet, TextInput, View, type TextInputProps } from 'react-native';
import { MIN_TOUCH } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { FieldMessage } from './field-message';
import { Text } from './text';

export type TextFieldProps = TextInputProps & { label: string; error?: string; hint?: string; unit?: string };

/** A labelled input with its hint and error underneath; the label is tied to the input for screen readers. */
export const TextField = forwardRef<TextInput, TextFieldProps>(function TextField(
  { label, error, hint, unit, style, ...rest },
  ref,
) {
  const t = useTheme();
  const id = useId();
  return (
    <View style={styles.wrap}>
      <Text variant="label" nativeID={`${id}-label`}>
        {label}
      </Text>
      <View
        style={[
          styles.box,
          { borderColor: error ? t.colors.danger : t.colors.border, backgroundColor: t.colors.surface },
        ]}
      >
        <TextInput
          ref={ref}
          aria-labelledby={`${id}-label`}
          aria-invalid={error ? true : undefined}
          placeholderTextColor={t.colors.textMuted}
          style={[styles.input, { color: t.colors.text, fontFamily: t.fontFamily.sans }, style]}
          {...rest}
        />
        {unit ? (
          <Text variant="label" color="textMuted" style={styles.unit}>
            {unit}
          </Text>
        ) : null}
      </View>
      <FieldMessage hint={hint} error={error} />
    </View>
  );
});

const styles = StyleSheet.create({
  wrap: { gap: 6 },
  box: { flexDirection: 'row', alignItems: 'center', borderWidth: 1.5, borderRadius: 10, minWidth: 0 },
  input: { flex: 1, minWidth: 0, minHeight: MIN_TOUCH + 4, paddingHorizontal: 12, fontSize: 17 },
  unit: { paddingRight: 12 },
});
