import type { ReactNode } from 'react';
import { ActivityIndicator, Pressable, StyleSheet, View, type PressableProps } from 'react-native';
import { MIN_TOUCH } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Text } from './text';

export type ButtonProps = Omit<PressableProps, 'children'> & {
  label: string;
  variant?: 'primary' | 'secondary' | 'quiet' | 'danger';
  loading?: boolean;
  icon?: ReactNode;
  size?: 'md' | 'lg';
};

/** The one button: primary (berry), secondary (outlined), quiet (text only), danger. */
export function Button({ label, variant = 'primary', loading, disabled, icon, size = 'md', style, ...rest }: ButtonProps) {
  const t = useTheme();
  const off = disabled || loading;
  const fg =
    variant === 'primary' ? 'onPrimary' : variant === 'danger' ? 'danger' : variant === 'quiet' ? 'primary' : 'text';
  return (
    <Pressable
      role="button"
      accessibilityState={{ disabled: !!off, busy: !!loading }}
      aria-disabled={off || undefined}
      disabled={off}
      style={(state) => [
        styles.base,
        size === 'lg' && styles.large,
        variant === 'primary' && { backgroundColor: state.pressed ? t.colors.primaryPressed : t.colors.primary },
        variant === 'secondary' && { borderWidth: 1.5, borderColor: t.colors.border, backgroundColor: t.colors.surface },
        variant === 'danger' && { borderWidth: 1.5, borderColor: t.colors.danger, backgroundColor: t.colors.surface },
        variant === 'quiet' && styles.quiet,
        off && styles.disabled,
        typeof style === 'function' ? style(state) : style,
      ]}
      {...rest}
    >
      <View style={styles.row}>
        {loading ? <ActivityIndicator size="small" color={t.colors[fg]} /> : icon}
        <Text variant={size === 'lg' ? 'lead' : 'label'} color={fg} weight="bold" style={styles.label}>
          {label}
        </Text>
      </View>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  base: { minHeight: MIN_TOUCH, maxWidth: '100%', paddingHorizontal: 18, paddingVertical: 6, borderRadius: 10, justifyContent: 'center', alignItems: 'center' },
  large: { minHeight: 54, paddingHorizontal: 24 },
  quiet: { paddingHorizontal: 8 },
  disabled: { opacity: 0.55 },
  row: { flexDirection: 'row', alignItems: 'center', gap: 8, flexShrink: 1 },
  label: { flexShrink: 1, textAlign: 'center' },
});
