import type { ReactNode } from 'react';
import { StyleSheet, View, type ViewProps } from 'react-native';
import { useTheme } from '../theme/use-theme';

/** A paper-like panel on the oat background. */
export function Card({ children, style, ...rest }: ViewProps & { children: ReactNode }) {
  const t = useTheme();
  return (
    <View style={[styles.card, { backgroundColor: t.colors.surface, borderColor: t.colors.border }, style]} {...rest}>
      {children}
    </View>
  );
}

const styles = StyleSheet.create({ card: { borderWidth: 1, borderRadius: 14, padding: 16, gap: 10 } });
