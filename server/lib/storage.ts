import crypto from 'node:crypto';
import fs from 'node:fs/promises';
import path from 'node:path';

/** The one storage interface for uploaded files (local disk now; object storage can implement the same). */
export interface FileStorage {
  put(key: string, data: Buffer): Promise<void>;
  /** The stored bytes, or null when nothing is stored under that key. */
  get(key: string): Promise<Buffer | null>;
  remove(key: string): Promise<void>;
}

/** The store has no room (disk full, quota): nothing was kept under the key. */
export class StorageFullError extends Error {
  constructor(cause: unknown) {
    super('file storage is full', { cause });
    this.name = 'StorageFullError';
  }
}

const KEY_PATTERN = /^[a-z0-9-]+(\/[a-z0-9-]+)*\.(jpg|png|webp)$/;

/** True for keys this storage accepts: lower-case segments, no dots but the extension, so no path tricks. */
export function isValidStorageKey(key: string): boolean {
  return KEY_PATTERN.test(key) && key.length <= 200;
}

/** A fresh, unguessable key under a folder: 128 random bits, url-safe. */
export function newStorageKey(folder: string, extension: 'jpg' | 'png' | 'webp'): string {
  const id = crypto.randomBytes(16).toString('hex');
  return `${folder}/${id}.${extension}`;
}

/** Files under a root folder on local disk, written atomically (temp file + rename). */
export function localDiskStorage(root: string): FileStorage {
  const resolve = (key: string) => {
    if (!isValidStorageKey(key)) throw new Error(`invalid storage key: ${key}`);
    return path.join(root, key);
  };
  return {
    async put(key, data) {
      const file = resolve(key);
      await fs.mkdir(path.dirname(file), { recursive: true });
      const temp = `${file}.${process.pid}.${crypto.randomBytes(4).toString('hex')}.tmp`;
      try {
        await fs.writeFile(temp, data, { mode: 0o640 });
        await fs.rename(temp, file);
      } catch (err) {
        // A write cut short (disk full) leaves no partial file behind, under the key or as a temp file.
        await fs.rm(temp, { force: true }).catch(() => undefined);
        const code = (err as NodeJS.ErrnoException).code;
        throw code === 'ENOSPC' || code === 'EDQUOT' ? new StorageFullError(err) : err;
      }
    },
    async get(key) {
      try {
        return await fs.readFile(resolve(key));
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code === 'ENOENT') return null;
        throw err;
      }
    },
    async remove(key) {
      await fs.rm(resolve(key), { force: true });
    },
  };
}
