import { createHash, randomBytes } from 'node:crypto';
import { createReadStream, existsSync, mkdirSync, renameSync, rmSync } from 'node:fs';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';

/**
 * Content-addressed file store under DATA_DIR/uploads: each file is kept once, at a path made
 * from its sha-256, and never overwritten. Writers stream into a private temporary file, hash as
 * they go, and move it into place only if no file with that content exists yet.
 */
export class BlobStore {
  readonly tmpDir: string;

  constructor(readonly root: string) {
    this.tmpDir = path.join(root, 'tmp');
    mkdirSync(this.tmpDir, { recursive: true });
  }

  pathOf(sha256: string): string {
    if (!/^[0-9a-f]{64}$/.test(sha256)) throw new RangeError(`Not a sha-256 digest: ${sha256}`);
    return path.join(this.root, sha256.slice(0, 2), sha256);
  }

  has(sha256: string): boolean {
    return existsSync(this.pathOf(sha256));
  }

  /** A fresh temporary path inside the store (same file system, so the final move is atomic). */
  tempPath(): string {
    return path.join(this.tmpDir, `${Date.now()}-${randomBytes(8).toString('hex')}`);
  }

  /** Digest and size of a file, read as a stream. */
  async hashFile(file: string): Promise<{ sha256: string; sizeBytes: number }> {
    const hash = createHash('sha256');
    let sizeBytes = 0;
    await pipeline(createReadStream(file), async function* (source: AsyncIterable<Buffer>) {
      for await (const chunk of source) {
        hash.update(chunk);
        sizeBytes += chunk.length;
      }
    });
    return { sha256: hash.digest('hex'), sizeBytes };
  }

  /** Moves a temporary file whose digest is already known into place. */
  commitHashed(tempFile: string, sha256: string, sizeBytes: number): { sha256: string; sizeBytes: number; existed: boolean } {
    const target = this.pathOf(sha256);
    if (existsSync(target)) {
      rmSync(tempFile, { force: true });
      return { sha256, sizeBytes, existed: true };
    }
    mkdirSync(path.dirname(target), { recursive: true });
    renameSync(tempFile, target);
    return { sha256, sizeBytes, existed: false };
  }
}
