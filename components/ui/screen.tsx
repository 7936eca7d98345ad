import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';
import { router, type Href } from 'expo-router';
import { useLayout, useTheme } from '../theme/use-theme';
import { Button } from './button';
import { Text } from './text';

export type ScreenProps = {
  title?: string;
  subtitle?: string;
  /** Show a back link; pass the href to use when there is no history (deep link). */
  backHref?: Href;
  actions?: ReactNode;
  children: ReactNode;
  scroll?: boolean;
};

/** A page: title row, then content in a centred column (wider on wide screens). */
export function Screen({ title, subtitle, backHref, actions, children, scroll = true }: ScreenProps) {
  const t = useTheme();
  const { contentMaxWidth, isWide } = useLayout();
  const body = (
    <View style={[styles.column, { maxWidth: contentMaxWidth, paddingHorizontal: isWide ? t.space.xxl : t.space.lg }]}>
      {backHref ? (
        <View style={styles.back}>
          <Button
            variant="quiet"
            label="‹ Back"
            onPress={() => (router.canGoBack() ? router.back() : router.replace(backHref))}
          />
        </View>
      ) : null}
      {title ? (
        <View style={styles.header}>
          <View style={styles.titles}>
            <Text variant="title" aria-level={1}>
              {title}
            </Text>
            {subtitle ? <Text color="textMuted">{subtitle}</Text> : null}
          </View>
          {actions ? <View style={styles.actions}>{actions}</View> : null}
        </View>
      ) : null}
      {children}
    </View>
  );
  return (
    <View style={[styles.fill, { backgroundColor: t.colors.background }]}>
      {scroll ? <ScrollView contentContainerStyle={styles.scroll}>{body}</ScrollView> : body}
    </View>
  );
}

const styles = StyleSheet.create({
  fill: { flex: 1 },
  scroll: { flexGrow: 1, paddingBottom: 32 },
  column: { width: '100%', alignSelf: 'center', paddingTop: 20, gap: 16 },
  back: { alignItems: 'flex-start', marginLeft: -8, marginBottom: -8 },
  header: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'flex-end', justifyContent: 'space-between', gap: 12 },
  titles: { gap: 4, flexShrink: 1 },
  actions: { flexDirection: 'row', gap: 8, flexWrap: 'wrap' },
});
