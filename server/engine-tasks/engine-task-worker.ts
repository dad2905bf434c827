import { parentPort } from 'node:worker_threads';
import { HttpError } from '../http/errors.js';
import { runEngineTask, type EngineTask } from './engine-tasks.js';

// One task at a time: the thread exists so the request thread never waits on the engine.
// A refusal with an HTTP status (a malformed upload) goes back with its status, code and fields.
parentPort!.on('message', async (msg: { id: number; task: EngineTask }) => {
  try {
    parentPort!.postMessage({ id: msg.id, ok: true, result: await runEngineTask(msg.task) });
  } catch (err) {
    const http = err instanceof HttpError ? { status: err.status, code: err.code, fields: err.fields } : undefined;
    parentPort!.postMessage({ id: msg.id, ok: false, error: (err as Error).message, http });
  }
});
parentPort!.postMessage({ ready: true });
