import type { RefObject } from 'react';

/** Brings a rendered view into sight (react-native-web views are DOM elements). */
export function scrollIntoView(ref: RefObject<unknown>) {
  const node = ref.current as { scrollIntoView?: (o: ScrollIntoViewOptions) => void } | null;
  node?.scrollIntoView?.({ behavior: 'smooth', block: 'start' });
}
