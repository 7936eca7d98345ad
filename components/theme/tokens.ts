import { Platform } from 'react-native';

/** Carbwright's palette: a warm kitchen notebook — oat cream, dark ink, one deep berry accent. */
export const palette = {
  background: '#F6F0E4',
  surface: '#FFFCF6',
  surfaceAlt: '#EEE5D4',
  border: '#D9CCB6',
  text: '#2B231F',
  textMuted: '#62564C',
  primary: '#7B2148',
  primaryPressed: '#5E1636',
  onPrimary: '#FFF8F1',
  primarySoft: '#F3E1E8',
  inRange: '#48674D',
  inRangeSoft: '#E1EADD',
  caution: '#8A5206',
  cautionSoft: '#FBEBC9',
  danger: '#9E2A1F',
  dangerSoft: '#F7DDD7',
  focus: '#2B5F8A',
} as const;

export type ThemeColor = keyof typeof palette;

/** The shade of each profile colour (the names live in shared/schemas/auth.ts), dark enough to read on the cream. */
export const profileShades = {
  teal: '#1F6B6B',
  plum: '#6A3A7A',
  amber: '#8A5A00',
  sky: '#2B5F8A',
  rose: '#9A3350',
  moss: '#4E6B2A',
} as const;

export const space = { xxs: 2, xs: 4, sm: 8, md: 12, lg: 16, xl: 24, xxl: 32, xxxl: 48 } as const;
export const radius = { sm: 6, md: 10, lg: 16, pill: 999 } as const;

export const fontFamily = {
  serif: 'Lora_400Regular',
  serifSemiBold: 'Lora_600SemiBold',
  serifBold: 'Lora_700Bold',
  sans: Platform.select({
    web: 'system-ui, -apple-system, "Segoe UI", Roboto, "Noto Sans", "Helvetica Neue", Arial, sans-serif',
    default: undefined,
  }),
} as const;

/** Type scale: large numbers for reading across a kitchen counter. */
export const fontSize = { caption: 13, body: 16, label: 15, lead: 18, heading: 21, title: 27, display: 38, number: 44 } as const;

/** At this width and above the app shows side navigation and side-by-side panes. */
export const WIDE_BREAKPOINT = 1024;
export const CONTENT_MAX_WIDTH = { phone: 640, wide: 1180 } as const;
export const MIN_TOUCH = 44;
