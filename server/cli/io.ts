import { once } from 'node:events';
import type { Readable, Writable } from 'node:stream';

/** The streams a command talks to (the process's own, or test doubles). */
export interface CliIo {
  stdin: Readable;
  stdout: Writable;
  stderr: Writable;
}

/** Writes text, waiting for the stream to drain when its buffer is full (constant memory). */
export async function writeAll(stream: Writable, text: string | Uint8Array): Promise<void> {
  if (!text.length) return;
  if (!stream.write(text)) await once(stream, 'drain');
}
