import { deviceStorage } from '../auth/device-storage';

const STORAGE_KEY = 'carbwright.offline-copy';

/**
 * Where the offline copy (components/api/offline-copy.ts) lives on this device, in the one device storage. Apart from
 * it so the session can forget the copy on sign-out without loading the query keys the copy is made from.
 */
export const offlineCopyStore = {
  read: (): string | null => deviceStorage()?.getItem(STORAGE_KEY) ?? null,
  /** False when the storage refused it (full or blocked). */
  write(text: string): boolean {
    try {
      deviceStorage()?.setItem(STORAGE_KEY, text);
      return true;
    } catch {
      return false;
    }
  },
  /** Forgets the copy (sign-out, a 401, no session, a copy too old). */
  clear: () => deviceStorage()?.removeItem(STORAGE_KEY),
};
