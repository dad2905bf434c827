import { randomBytes } from 'node:crypto';
import fs from 'node:fs/promises';
import path from 'node:path';

/**
 * Rendered PNGs on disk under <dataDir>/heatmaps/<auditId>/. The file name carries a hash of
 * everything the picture depends on, so a name can never hold a stale picture (even across
 * databases that reuse audit ids); writes go through a temporary file and a rename, so a reader
 * never sees half a file. Concurrent renders of the same picture share one promise.
 */
export class HeatmapDiskCache {
  private readonly inFlight = new Map<string, Promise<Buffer>>();

  /** Told when a rendered picture could not be cached; by default a process warning (stderr, the process log). */
  onWriteError: (err: unknown) => void = (err) =>
    process.emitWarning(`A heatmap could not be cached: ${(err as Error)?.message ?? err}`, 'HeatmapCacheWarning');

  constructor(private readonly root: string) {}

  pathFor(auditId: number, name: string): string {
    return path.join(this.root, 'heatmaps', String(auditId), name);
  }

  async getOrRender(auditId: number, name: string, render: () => Promise<Buffer>): Promise<{ png: Buffer; cached: boolean }> {
    const file = this.pathFor(auditId, name);
    try {
      return { png: await fs.readFile(file), cached: true };
    } catch {
      // Not rendered yet.
    }
    let pending = this.inFlight.get(file);
    if (!pending) {
      pending = (async () => {
        const png = await render();
        await this.store(file, png);
        return png;
      })().finally(() => this.inFlight.delete(file));
      this.inFlight.set(file, pending);
    }
    return { png: await pending, cached: false };
  }

  /**
   * Writes through a temporary file and a rename. A failed write (disk full, directory not
   * creatable) removes its temporary file and is not the caller's failure: the picture is still
   * served, only not cached, and the next request tries to cache it again.
   */
  private async store(file: string, png: Buffer): Promise<void> {
    const tmp = `${file}.${randomBytes(4).toString('hex')}.tmp`;
    try {
      await fs.mkdir(path.dirname(file), { recursive: true });
      await fs.writeFile(tmp, png);
      await fs.rename(tmp, file);
    } catch (err) {
      await fs.rm(tmp, { force: true }).catch(() => {});
      this.onWriteError(err);
    }
  }
}
