import { apiErrorSchema } from '../../shared/schemas/api-error';
import { sessionCookie } from '../auth/session-cookie';
import { isOnline, NOT_SAVED_OFFLINE } from './online';

/** An error answer from the API, in the one shape the server sends. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fieldErrors?: Record<string, string[]>,
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

let onUnauthorized: (() => void) | undefined;
/** Registers what happens when any call answers 401 (the session signs out). */
export function setUnauthorizedHandler(handler: (() => void) | undefined) {
  onUnauthorized = handler;
}

let onProfileMissing: ((profileId: number) => void) | undefined;
/** Registers what happens when a call about a profile answers 404 (access revoked, or the profile is gone). */
export function setProfileMissingHandler(handler: ((profileId: number) => void) | undefined) {
  onProfileMissing = handler;
}

/** Same origin on the web build; EXPO_PUBLIC_API_URL points elsewhere in development. */
export const API_BASE = process.env.EXPO_PUBLIC_API_URL ?? '';

type Init = Omit<RequestInit, 'body'> & { body?: unknown };

/** "?a=1&b=x" from the defined, non-empty values ('' when none). */
export function queryString(params: Record<string, string | number | undefined | null>): string {
  const parts = Object.entries(params)
    .filter(([, v]) => v != null && v !== '')
    .map(([k, v]) => `${k}=${encodeURIComponent(String(v))}`);
  return parts.length ? `?${parts.join('&')}` : '';
}

/** The one fetch wrapper: JSON in and out, the session cookie and its CSRF header, errors as ApiError; no write offline. */
export async function apiFetch<T>(path: string, init: Init = {}): Promise<T> {
  const res = await send(path, init);
  if (res.status === 204) return undefined as T;
  const text = await res.text();
  return (text ? safeJson(text) : undefined) as T;
}

/** The same call for a binary answer (a photo behind the session). */
export async function apiFetchBlob(path: string, init: Init = {}): Promise<Blob> {
  return (await send(path, init)).blob();
}

async function send(path: string, init: Init): Promise<Response> {
  const csrf = sessionCookie.csrf();
  const headers = new Headers(init.headers);
  headers.set('Accept', 'application/json');
  const isForm = typeof FormData !== 'undefined' && init.body instanceof FormData;
  if (init.body !== undefined && !isForm) headers.set('Content-Type', 'application/json');
  const method = (init.method ?? 'GET').toUpperCase();
  const writes = method !== 'GET' && method !== 'HEAD';
  // Offline a write is refused here, never queued or shown as saved.
  if (writes && !isOnline()) throw new ApiError(0, 'offline', NOT_SAVED_OFFLINE);
  if (csrf && writes) headers.set('X-CSRF-Token', csrf);
  let res: Response;
  try {
    res = await fetch(`${API_BASE}/api${path}`, {
      ...init,
      headers,
      credentials: 'same-origin',
      body: init.body === undefined ? undefined : isForm ? (init.body as FormData) : JSON.stringify(init.body),
    });
  } catch (err) {
    if ((err as Error)?.name === 'AbortError') throw err;
    throw new ApiError(0, 'network', 'We could not reach Carbwright. Check your connection and try again.');
  }
  if (res.ok) return res;
  const text = await res.text();
  if (res.status === 401 && csrf) onUnauthorized?.();
  const profileId = res.status === 404 ? /^\/profiles\/(\d+)(?:\/|$)/.exec(path)?.[1] : undefined;
  if (profileId) onProfileMissing?.(Number(profileId));
  const parsed = apiErrorSchema.safeParse(text ? safeJson(text) : undefined);
  if (parsed.success) {
    const { code, message, fieldErrors } = parsed.data.error;
    throw new ApiError(res.status, code, message, fieldErrors);
  }
  throw new ApiError(res.status, 'internal', 'Something went wrong on our side. Please try again.');
}

function safeJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return undefined;
  }
}
