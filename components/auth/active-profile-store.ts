import { useSyncExternalStore } from 'react';
import { deviceStorage } from './device-storage';

const KEY = 'carbwright.active-profile';
const listeners = new Set<() => void>();

function read(): number | null {
  const value = Number(deviceStorage()?.getItem(KEY));
  return Number.isInteger(value) && value > 0 ? value : null;
}

let current = read();

/** Which profile this device is working on (its id), kept across reloads. */
export const activeProfileStore = {
  get: () => current,
  set(id: number) {
    current = id;
    deviceStorage()?.setItem(KEY, String(id));
    for (const l of listeners) l();
  },
  subscribe(listener: () => void) {
    listeners.add(listener);
    return () => listeners.delete(listener);
  },
};

/** The chosen profile id (null until someone switches), re-rendering on a switch. */
export function useActiveProfileId(): number | null {
  return useSyncExternalStore(activeProfileStore.subscribe, activeProfileStore.get, activeProfileStore.get);
}
