import { useWindowDimensions } from 'react-native';
import { CONTENT_MAX_WIDTH, WIDE_BREAKPOINT, fontFamily, fontSize, palette, radius, space } from './tokens';

const theme = { colors: palette, space, radius, fontFamily, fontSize } as const;
export type Theme = typeof theme;

/** The current theme (one light palette for now). */
export function useTheme(): Theme {
  return theme;
}

/** Whether the window is wide enough for side navigation and two panes. */
export function useLayout() {
  const { width } = useWindowDimensions();
  const isWide = width >= WIDE_BREAKPOINT;
  return { width, isWide, contentMaxWidth: isWide ? CONTENT_MAX_WIDTH.wide : CONTENT_MAX_WIDTH.phone };
}
