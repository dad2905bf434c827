/**
 * Runs pacedLoad in a process of its own (options as JSON in WM_PACED_LOAD, the result as JSON on
 * stdout), so that the load generator's timing does not share a heap, an event loop or a garbage
 * collector with the bench process that ran autocannon before it.
 */
import { pacedLoad, type PacedLoadOptions } from './paced-load';

const opts = JSON.parse(process.env.WM_PACED_LOAD ?? '{}') as PacedLoadOptions;
const result = await pacedLoad(opts);
process.stdout.write(`${JSON.stringify(result)}\n`);
