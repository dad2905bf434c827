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
        await fs.mkdir(path.dirname(file), { recursive: true });
        const tmp = `${file}.${randomBytes(4).toString('hex')}.tmp`;
        await fs.writeFile(tmp, png);
        await fs.rename(tmp, file);
        return png;
      })().finally(() => this.inFlight.delete(file));
      this.inFlight.set(file, pending);
    }
    return { png: await pending, cached: false };
  }
}
