import { StyleSheet, Text as RNText, type TextProps as RNTextProps, type TextStyle } from 'react-native';
import { useTheme } from '../theme/use-theme';
import type { ThemeColor } from '../theme/tokens';

export type TextVariant = 'display' | 'title' | 'heading' | 'lead' | 'body' | 'label' | 'caption' | 'number';

export type TextProps = RNTextProps & { variant?: TextVariant; color?: ThemeColor; weight?: 'regular' | 'bold' };

/** All text in the app: Lora for headings and big numbers, the system sans-serif for reading. */
export function Text({ variant = 'body', color = 'text', weight, style, ...rest }: TextProps) {
  const t = useTheme();
  const serif = variant === 'display' || variant === 'title' || variant === 'heading' || variant === 'number';
  const family = serif
    ? variant === 'heading'
      ? t.fontFamily.serifSemiBold
      : t.fontFamily.serifBold
    : t.fontFamily.sans;
  const role = variant === 'display' || variant === 'title' || variant === 'heading' ? ('heading' as const) : undefined;
  const variantStyle: TextStyle = {
    fontFamily: family,
    fontSize: t.fontSize[variant],
    color: t.colors[color],
    fontWeight: weight === 'bold' || variant === 'label' ? '600' : undefined,
  };
  return <RNText role={role} style={[styles.base, variantStyle, lineHeights[variant], style]} {...rest} />;
}

const lineHeights = StyleSheet.create({
  display: { lineHeight: 44 },
  title: { lineHeight: 34 },
  heading: { lineHeight: 28 },
  lead: { lineHeight: 26 },
  body: { lineHeight: 23 },
  label: { lineHeight: 20 },
  caption: { lineHeight: 18 },
  number: { lineHeight: 50 },
});

const styles = StyleSheet.create({ base: {} });
