import { router, type Href } from 'expo-router';

/** After saving: back to the page that opened this one, or to `href` when there is none (deep link). */
export function leaveTo(href: Href) {
  if (router.canGoBack()) router.back();
  else router.replace(href);
}
