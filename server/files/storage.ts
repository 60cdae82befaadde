import { createReadStream } from 'node:fs';
import { mkdir, rm, stat, writeFile } from 'node:fs/promises';
import path from 'node:path';
import type { Readable } from 'node:stream';

/**
 * Where file bytes live. Local disk by default; an S3-compatible store implements the same
 * three calls when Wardbook runs on more than one machine.
 */
export interface FileStorage {
  put(key: string, bytes: Buffer): Promise<void>;
  /** Undefined when there is no such object. */
  open(key: string): Promise<Readable | undefined>;
  remove(key: string): Promise<void>;
}

const KEY = /^[a-z0-9-]+(\/[a-z0-9-]+)*$/;

/** Keys are made by Wardbook (site id / file id), never by a client, and checked anyway. */
function safePath(root: string, key: string) {
  if (!KEY.test(key)) throw new Error(`refusing storage key ${JSON.stringify(key)}`);
  return path.join(root, ...key.split('/'));
}

export function createLocalDiskStorage(root: string): FileStorage {
  return {
    async put(key, bytes) {
      const file = safePath(root, key);
      await mkdir(path.dirname(file), { recursive: true });
      await writeFile(file, bytes, { flag: 'wx' });
    },
    async open(key) {
      const file = safePath(root, key);
      try {
        await stat(file);
      } catch {
        return undefined;
      }
      return createReadStream(file);
    },
    async remove(key) {
      await rm(safePath(root, key), { force: true });
    },
  };
}
