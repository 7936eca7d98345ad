import type { ReactNode } from 'react';
import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { ApiError } from '../api/client';
import { useIsOnline } from '../api/online';
import { useTheme } from '../theme/use-theme';
import { Button } from './button';
import { Text } from './text';

/** Shown while a query loads; offline (queries wait for a connection) it says so instead of spinning. */
export function LoadingState({ label = 'Loading…' }: { label?: string }) {
  const t = useTheme();
  const online = useIsOnline();
  if (!online) {
    return (
      <View style={styles.center} role="status">
        <Text weight="bold">You are offline</Text>
        <Text color="textMuted" style={styles.text}>
          This part was not kept on this device. It loads when you are back online.
        </Text>
      </View>
    );
  }
  return (
    <View style={styles.center} role="progressbar" aria-label={label}>
      <ActivityIndicator color={t.colors.primary} />
      <Text color="textMuted">{label}</Text>
    </View>
  );
}

/** Shown when a query failed, with the server's words where it gave any. */
export function ErrorState({ error, onRetry }: { error: unknown; onRetry?: () => void }) {
  const message =
    error instanceof ApiError ? error.message : 'We could not reach Carbwright. Check your connection and try again.';
  return (
    <View style={styles.center} role="alert">
      <Text variant="heading">That did not load</Text>
      <Text color="textMuted" style={styles.text}>
        {message}
      </Text>
      {onRetry ? <Button variant="secondary" label="Try again" onPress={onRetry} /> : null}
    </View>
  );
}

/** An honest empty state: what will be here and how to get it there. */
export function EmptyState({ title, children, action }: { title: string; children?: ReactNode; action?: ReactNode }) {
  const t = useTheme();
  return (
    <View style={[styles.empty, { borderColor: t.colors.border }]}>
      <Text variant="heading">{title}</Text>
      {typeof children === 'string' ? (
        <Text color="textMuted" style={styles.text}>
          {children}
        </Text>
      ) : (
        children
      )}
      {action}
    </View>
  );
}

const styles = StyleSheet.create({
  center: { alignItems: 'center', justifyContent: 'center', padding: 32, gap: 12 },
  empty: { borderWidth: 1.5, borderStyle: 'dashed', borderRadius: 14, padding: 24, gap: 10, alignItems: 'flex-start' },
  text: { maxWidth: 520 },
});
