/** A post-sign-in destination from ?next=, accepted only when it is a path inside the app. */
export function safeNext(next: unknown): string {
  const value = Array.isArray(next) ? next[0] : next;
  if (typeof value !== 'string' || !value.startsWith('/') || value.startsWith('//') || value.includes('\\')) return '/';
  if (value.startsWith('/sign-in') || value.startsWith('/sign-up')) return '/';
  return value;
}
