import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { useTheme } from '../theme/use-theme';
import { Text } from './text';

export type CalloutTone = 'info' | 'caution' | 'danger' | 'ok';

const TONE = {
  info: { bg: 'surfaceAlt', fg: 'text', mark: 'i', word: 'Note' },
  caution: { bg: 'cautionSoft', fg: 'caution', mark: '!', word: 'Caution' },
  danger: { bg: 'dangerSoft', fg: 'danger', mark: '!!', word: 'Stop' },
  ok: { bg: 'inRangeSoft', fg: 'inRange', mark: '✓', word: 'Good' },
} as const;

/** A boxed message. The tone is said in words and a mark too, never by colour alone. */
export function Callout({ tone = 'info', title, children }: { tone?: CalloutTone; title?: string; children?: ReactNode }) {
  const t = useTheme();
  const c = TONE[tone];
  return (
    <View
      role={tone === 'danger' ? 'alert' : undefined}
      style={[styles.box, { backgroundColor: t.colors[c.bg], borderLeftColor: t.colors[c.fg] }]}
    >
      <Text variant="label" color={c.fg}>
        {c.mark} {title ?? c.word}
      </Text>
      {typeof children === 'string' ? <Text>{children}</Text> : children}
    </View>
  );
}

const styles = StyleSheet.create({ box: { borderLeftWidth: 5, borderRadius: 10, padding: 14, gap: 6 } });
