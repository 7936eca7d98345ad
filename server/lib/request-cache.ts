import { AsyncLocalStorage } from 'node:async_hooks';
import type { NextFunction, Request, Response } from 'express';

// What one request has already read and that cannot change during it (the signed-in user, a profile's units).
const store = new AsyncLocalStorage<Map<string, Promise<unknown>>>();

/** Gives every request its own cache (mounted once in createApp before the API routes). */
export function requestCache(_req: Request, _res: Response, next: NextFunction) {
  store.run(new Map(), next);
}

/** The value under `key` if this request already loaded it, else `load()` once; outside a request, always `load()`. */
export function remember<T>(key: string, load: () => Promise<T>): Promise<T> {
  const cache = store.getStore();
  if (!cache) return load();
  if (!cache.has(key)) cache.set(key, load());
  return cache.get(key) as Promise<T>;
}

/** Puts a value this request already has into its cache (e.g. read together with the sign-in check). */
export function rememberValue<T>(key: string, value: T): void {
  store.getStore()?.set(key, Promise.resolve(value));
}

/** Drops a cached value after this request changed it. */
export function forget(key: string): void {
  store.getStore()?.delete(key);
}
