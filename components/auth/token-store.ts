/** The one place the session token is kept: web storage, under one key. */
const KEY = 'carbwright.session';

function storage(): Storage | undefined {
  try {
    return typeof globalThis.localStorage === 'undefined' ? undefined : globalThis.localStorage;
  } catch {
    return undefined;
  }
}

export const tokenStore = {
  get(): string | null {
    return storage()?.getItem(KEY) ?? null;
  },
  set(token: string) {
    storage()?.setItem(KEY, token);
  },
  clear() {
    storage()?.removeItem(KEY);
  },
};
