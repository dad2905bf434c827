import { parentPort } from 'node:worker_threads';
import { runEngineTask, type EngineTask } from './engine-tasks.js';

// One task at a time: the thread exists so the request thread never waits on the engine.
parentPort!.on('message', (msg: { id: number; task: EngineTask }) => {
  try {
    parentPort!.postMessage({ id: msg.id, ok: true, result: runEngineTask(msg.task) });
  } catch (err) {
    parentPort!.postMessage({ id: msg.id, ok: false, error: (err as Error).message });
  }
});
parentPort!.postMessage({ ready: true });
