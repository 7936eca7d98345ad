import { StyleSheet, View } from 'react-native';
import { palette } from '../theme/tokens';
import { Text } from '../ui/text';

const SVG_STYLE = { display: 'block', flexShrink: 0 } as const;

/**
 * Carbwright's mark: a lidded food container with a scale dial. The same drawing as assets/mark.svg (the source of
 * the favicon and icon PNGs; tests/components/mark.test.tsx keeps the two alike). Decorative beside the name. Plain SVG
 * elements (the app ships on the web only), so the signed-out pages load no SVG library.
 */
export function Mark({ size = 32 }: { size?: number }) {
  return (
    <svg width={size} height={size} viewBox="0 0 64 64" aria-hidden="true" focusable="false" style={SVG_STYLE}>
      <rect width={64} height={64} rx={14} fill={palette.primary} />
      <rect x={8} y={16} width={48} height={9} rx={4.5} fill={palette.background} />
      <path d="M11 28h42v14a8 8 0 0 1-8 8H19a8 8 0 0 1-8-8z" fill={palette.background} />
      <path d="M22 44a10 10 0 0 1 20 0" fill="none" stroke={palette.primary} strokeWidth={3} strokeLinecap="round" />
      <path d="M32 44l6-6.5" fill="none" stroke={palette.text} strokeWidth={3} strokeLinecap="round" />
      <circle cx={32} cy={44} r={2.6} fill={palette.text} />
    </svg>
  );
}

/** The mark and the name side by side: the side rail's header and the signed-out pages' title. */
export function Brand({ large = false }: { large?: boolean }) {
  return (
    <View style={[styles.brand, large && styles.large]}>
      <Mark size={large ? 44 : 34} />
      <Text variant={large ? 'display' : 'heading'} color="primary">
        Carbwright
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  brand: { flexDirection: 'row', alignItems: 'center', gap: 10 },
  large: { gap: 12 },
});
