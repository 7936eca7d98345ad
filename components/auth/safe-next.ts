import type { Href } from 'expo-router';

/** A post-sign-in destination from ?next=, accepted only when it is a path inside the app. */
export function safeNext(next: unknown): Href {
  const value = Array.isArray(next) ? next[0] : next;
  if (typeof value !== 'string' || !value.startsWith('/') || value.startsWith('//') || value.includes('\\')) return '/';
  if (value.startsWith('/sign-in') || value.startsWith('/sign-up')) return '/';
  // Checked above to be a path inside this app; an unknown path lands on the not-found screen.
  return value as Href;
}
