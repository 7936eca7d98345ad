import { deviceStorage } from './device-storage';

/** The one place the session token is kept: web storage, under one key. */
const KEY = 'carbwright.session';


export const tokenStore = {
  get(): string | null {
    return deviceStorage()?.getItem(KEY) ?? null;
  },
  set(token: string) {
    deviceStorage()?.setItem(KEY, token);
  },
  clear() {
    deviceStorage()?.removeItem(KEY);
  },
};
