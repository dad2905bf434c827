import { crc32 } from 'node:zlib';
import JSZip from 'jszip';
import { invalidRegion, mb, regionTooLarge, UPLOAD_LIMITS } from './region-errors.js';

/** One file of a zip as its central directory describes it (nothing decompressed yet). */
export interface ZipEntryInfo {
  name: string;
  compressedBytes: number;
  uncompressedBytes: number;
  crc32: number | undefined;
  entry: JSZip.JSZipObject;
}

// JSZip keeps the sizes it read from the central directory on the (untyped) _data object, and
// its chunked decompression stream (internalStream) is public API missing from its typings.
type SizedEntry = JSZip.JSZipObject & {
  _data?: { compressedSize?: number; uncompressedSize?: number; crc32?: number };
  unsafeOriginalName?: string;
};
interface ChunkStream {
  on(event: 'data', fn: (chunk: Buffer) => void): ChunkStream;
  on(event: 'error', fn: (err: Error) => void): ChunkStream;
  on(event: 'end', fn: () => void): ChunkStream;
  pause(): ChunkStream;
  resume(): ChunkStream;
}

/** A name that could write outside the folder it is unpacked into. */
export function isUnsafeZipPath(name: string): boolean {
  return (
    name.includes('\\') ||
    name.startsWith('/') ||
    /^[a-z]:/i.test(name) ||
    name.split('/').some((part) => part === '..') ||
    name.includes('\0')
  );
}

/**
 * Reads a zip's central directory and checks it before anything is decompressed: entry count,
 * unsafe names (`..`, absolute paths, backslashes, drive letters), the total declared
 * uncompressed size and each entry's compression ratio.
 */
export async function openZip(buffer: Buffer, fileName: string): Promise<ZipEntryInfo[]> {
  let zip: JSZip;
  try {
    // checkCRC32 would decompress every entry inside loadAsync, before our size checks: we check
    // each CRC ourselves while unpacking (readZipEntry).
    zip = await JSZip.loadAsync(buffer, { checkCRC32: false, createFolders: false });
  } catch (err) {
    throw invalidRegion(`${fileName} is not a readable zip archive (${(err as Error).message.replace(/\s+/g, ' ').slice(0, 120)}).`);
  }
  const all = Object.values(zip.files) as SizedEntry[];
  if (all.length > UPLOAD_LIMITS.zipEntries) {
    throw invalidRegion(`${fileName} holds ${all.length} entries; a zipped shapefile needs only a handful (at most ${UPLOAD_LIMITS.zipEntries}).`);
  }
  const entries: ZipEntryInfo[] = [];
  let total = 0;
  for (const e of all) {
    const original = e.unsafeOriginalName ?? e.name;
    if (isUnsafeZipPath(original)) {
      throw invalidRegion(`${fileName} contains an entry with an unsafe path ("${original.slice(0, 120)}"); paths with "..", a leading "/" or backslashes are refused.`);
    }
    if (e.dir) continue;
    const compressedBytes = Number(e._data?.compressedSize ?? 0);
    const uncompressedBytes = Number(e._data?.uncompressedSize ?? 0);
    total += uncompressedBytes;
    if (total > UPLOAD_LIMITS.unzippedBytes) {
      throw regionTooLarge(`${fileName} would unpack to more than ${mb(UPLOAD_LIMITS.unzippedBytes)}; the limit guards against decompression bombs.`);
    }
    if (uncompressedBytes > UPLOAD_LIMITS.ratioFloorBytes && uncompressedBytes > UPLOAD_LIMITS.maxRatio * Math.max(compressedBytes, 1)) {
      throw invalidRegion(
        `${fileName}: "${original}" would expand ${Math.round(uncompressedBytes / Math.max(compressedBytes, 1))}× (from ${mb(compressedBytes)} to ${mb(uncompressedBytes)}), which only decompression bombs do; the file was refused.`,
      );
    }
    entries.push({ name: original, compressedBytes, uncompressedBytes, crc32: e._data?.crc32, entry: e });
  }
  return entries;
}

/**
 * Decompresses one entry, counting bytes as they come out: an entry whose data unpacks to more
 * than its central directory declared (a forged header) is stopped at that size, not after.
 * The result must have exactly the declared size and CRC-32 (PKWARE APPNOTE 4.4.7).
 */
export function readZipEntry(info: ZipEntryInfo): Promise<Buffer> {
  const cap = info.uncompressedBytes;
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    let got = 0;
    let done = false;
    const stream = (info.entry as unknown as { internalStream(type: 'nodebuffer'): ChunkStream }).internalStream('nodebuffer');
    stream
      .on('data', (chunk: Buffer) => {
        if (done) return;
        got += chunk.length;
        if (got > cap) {
          done = true;
          stream.pause();
          reject(invalidRegion(`"${info.name}" unpacks to more than the ${mb(cap)} its zip header declares; the archive is corrupt or forged.`));
          return;
        }
        chunks.push(chunk);
      })
      .on('error', (err: Error) => {
        if (done) return;
        done = true;
        reject(invalidRegion(`"${info.name}" could not be unpacked (${err.message.slice(0, 120)}).`));
      })
      .on('end', () => {
        if (done) return;
        done = true;
        const data = Buffer.concat(chunks, got);
        if (got !== cap) {
          reject(invalidRegion(`"${info.name}" unpacks to ${got} bytes, not the ${cap} its zip header declares; the archive is damaged.`));
        } else if (info.crc32 !== undefined && crc32(data) >>> 0 !== info.crc32 >>> 0) {
          reject(invalidRegion(`"${info.name}" is damaged: its checksum (CRC-32) does not match the zip header.`));
        } else resolve(data);
      })
      .resume();
  });
}
