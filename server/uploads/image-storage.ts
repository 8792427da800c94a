import { mkdir, readFile, rename, rm, writeFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { randomUUID } from 'node:crypto';

/**
 * Where product image bytes live. Local disk by default; an object store can take its place
 * when several app servers share the images, since callers only save, read and remove by name.
 */
export interface ImageStorage {
  save(name: string, bytes: Buffer): Promise<void>;
  /** undefined when there is no such image. */
  read(name: string): Promise<Buffer | undefined>;
  remove(name: string): Promise<void>;
}

/** Generated names only: 64 hex digits (sha-256 of the bytes) and a known extension. */
export const imageNamePattern = /^[0-9a-f]{64}\.(png|jpg|webp|gif|avif)$/;

export class LocalDiskImageStorage implements ImageStorage {
  private readonly dir: string;
  constructor(root: string) {
    this.dir = resolve(root, 'product-images');
  }

  private pathOf(name: string): string {
    // The pattern admits no slash or dot-dot, so a name can never leave the folder.
    if (!imageNamePattern.test(name)) throw new Error(`Refusing image name '${name}'`);
    return join(this.dir, name);
  }

  async save(name: string, bytes: Buffer): Promise<void> {
    await mkdir(this.dir, { recursive: true });
    // Written beside and renamed, so a reader never sees half a file.
    const tmp = join(this.dir, `.${randomUUID()}.tmp`);
    await writeFile(tmp, bytes);
    await rename(tmp, this.pathOf(name));
  }

  async read(name: string): Promise<Buffer | undefined> {
    if (!imageNamePattern.test(name)) return undefined;
    try {
      return await readFile(this.pathOf(name));
    } catch (e) {
      if ((e as { code?: string }).code === 'ENOENT') return undefined;
      throw e;
    }
  }

  async remove(name: string): Promise<void> {
    await rm(this.pathOf(name), { force: true });
  }
}
