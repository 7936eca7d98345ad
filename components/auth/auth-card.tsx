import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { Card } from '../ui/card';
import { Text } from '../ui/text';
import { useTheme } from '../theme/use-theme';
import { Brand } from '../nav/mark';

/** The signed-out frame: the name, one line of what it is for, then the form. */
export function AuthCard({ title, children }: { title: string; children: ReactNode }) {
  const t = useTheme();
  return (
    <View role="main" style={[styles.page, { backgroundColor: t.colors.background }]}>
      <View style={styles.column}>
        <View style={styles.brand}>
          <Brand large />
          <Text color="textMuted">Weighed batches, known carbohydrate, doses you can follow.</Text>
        </View>
        <Card style={styles.card}>
          <Text variant="title" aria-level={1}>
            {title}
          </Text>
          {children}
        </Card>
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  page: { flex: 1, justifyContent: 'center', padding: 16 },
  column: { width: '100%', maxWidth: 440, alignSelf: 'center', gap: 24 },
  brand: { gap: 6 },
  card: { gap: 16, padding: 20 },
});
