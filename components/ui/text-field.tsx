import { forwardRef, useId, useState } from 'react';
import { StyleSheet, TextInput, View, type TextInputProps, type TextStyle } from 'react-native';
import { MIN_TOUCH } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { FieldMessage } from './field-message';
import { Text } from './text';

export type TextFieldProps = TextInputProps & { label: string; error?: string; hint?: string; unit?: string };

/** A labelled input with its hint and error underneath; the label is tied to the input for screen readers. */
export const TextField = forwardRef<TextInput, TextFieldProps>(function TextField(
  { label, error, hint, unit, style, onFocus, onBlur, ...rest },
  ref,
) {
  const t = useTheme();
  const id = useId();
  // The focus ring goes around the whole box, outside its border: the unit stays readable and the error border shows.
  const [focused, setFocused] = useState(false);
  return (
    <View style={styles.wrap}>
      <Text variant="label" nativeID={`${id}-label`}>
        {label}
      </Text>
      <View
        style={[
          styles.box,
          { borderColor: error ? t.colors.danger : t.colors.border, backgroundColor: t.colors.surface },
          focused && [styles.focusRing, { outlineColor: t.colors.focus }],
        ]}
      >
        <TextInput
          ref={ref}
          // The browser wants an id (or name) on every form field, for autofill and its own checks.
          nativeID={`${id}-input`}
          aria-labelledby={`${id}-label`}
          aria-invalid={error ? true : undefined}
          placeholderTextColor={t.colors.textMuted}
          style={[styles.input, { color: t.colors.text, fontFamily: t.fontFamily.sans }, style]}
          onFocus={(e) => {
            setFocused(true);
            onFocus?.(e);
          }}
          onBlur={(e) => {
            setFocused(false);
            onBlur?.(e);
          }}
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
  // In a row beside a button the field gives way; alone in a column it keeps its full width.
  wrap: { gap: 6, flexShrink: 1, minWidth: 0 },
  box: { flexDirection: 'row', alignItems: 'center', borderWidth: 1.5, borderRadius: 10, minWidth: 0 },
  // The browser's own ring on the input is replaced by the box's ring (react-native-web passes 'none' through).
  input: { flex: 1, minWidth: 0, minHeight: MIN_TOUCH + 4, paddingHorizontal: 12, fontSize: 17, outlineStyle: 'none' as TextStyle['outlineStyle'] },
  focusRing: { outlineWidth: 2, outlineStyle: 'solid', outlineOffset: 2 },
  unit: { paddingRight: 12 },
});
