import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { isValidStorageKey, localDiskStorage } from '../../server/lib/storage';

describe('storage keys', () => {
  it.each([
    { name: 'a stored photo name', key: 'recipes/0123456789abcdef0123456789abcdef.jpg', valid: true },
    { name: 'a label photo in a nested folder', key: 'label-photos/ab/cd.png', valid: true },
    { name: 'a climb out of the folder', key: 'recipes/../../etc/passwd.jpg', valid: false },
    { name: 'a climb with no folder', key: '../secret.jpg', valid: false },
    { name: 'an absolute path', key: '/etc/passwd.jpg', valid: false },
    { name: 'a backslash path', key: 'recipes\\..\\x.jpg', valid: false },
    { name: 'a file that is not a photo', key: 'recipes/notes.txt', valid: false },
    { name: 'a hidden second extension', key: 'recipes/x.jpg.sh', valid: false },
    { name: 'a key over 200 characters', key: `recipes/${'a'.repeat(200)}.jpg`, valid: false },
  ])('$name: $valid', ({ key, valid }) => {
    expect(isValidStorageKey(key)).toBe(valid);
  });

  it('local disk storage refuses to read a climbing key even when the file it points at exists', async () => {
    const root = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-storage-'));
    const outside = `${root}-outside.jpg`;
    fs.writeFileSync(outside, 'PRIVATE');
    try {
      await expect(localDiskStorage(root).get(`recipes/../../${path.basename(outside)}`)).rejects.toThrow('invalid storage key');
    } finally {
      fs.rmSync(outside);
      fs.rmSync(root, { recursive: true, force: true });
    }
  });
});
