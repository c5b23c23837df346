import { randomUUID } from 'node:crypto';
import { mkdir, readFile, rename, rm, stat, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { checkKey, StoredFileMissing, type FileStorage } from './types';

/**
 * Files in a folder on this machine (FILES_DIR, default .data/files). A file
 * is written to a temporary name and renamed into place, so a reader never
 * sees half a file and a failed write leaves nothing under the key.
 */
export class LocalFileStorage implements FileStorage {
  readonly kind = 'local' as const;
  private readonly root: string;

  constructor(dir: string) {
    this.root = path.resolve(dir);
  }

  private pathOf(key: string) {
    return path.join(this.root, ...checkKey(key).split('/'));
  }

  async put(key: string, content: Buffer): Promise<void> {
    const target = this.pathOf(key);
    await mkdir(path.dirname(target), { recursive: true });
    const temporary = `${target}.${randomUUID()}.partial`;
    try {
      await writeFile(temporary, content, { flag: 'wx' });
      await rename(temporary, target);
    } catch (error) {
      await rm(temporary, { force: true });
      throw error;
    }
  }

  async get(key: string): Promise<Buffer> {
    try {
      return await readFile(this.pathOf(key));
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code === 'ENOENT') throw new StoredFileMissing(key);
      throw error;
    }
  }

  async delete(key: string): Promise<void> {
    await rm(this.pathOf(key), { force: true });
  }

  async exists(key: string): Promise<boolean> {
    try {
      return (await stat(this.pathOf(key))).isFile();
    } catch {
      return false;
    }
  }
}
