import { describe, expect, it } from 'vitest';
import { closeSharedEngineThread, sharedEngineThread } from './engine-thread.js';

const messagePorts = () => process.getActiveResourcesInfo().filter((r) => r === 'MessagePort').length;
const square = { type: 'Polygon' as const, coordinates: [[[5, 45], [15, 45], [15, 55], [5, 55], [5, 45]]] };

describe('the app’s engine thread', () => {
  it('runs a task, and once closed leaves nothing that holds the process open', async () => {
    const services: Record<string, unknown> = {};
    const before = messagePorts();
    const thread = sharedEngineThread(services);
    expect(sharedEngineThread(services)).toBe(thread);
    const { proposals } = await thread.run({ kind: 'suggest', geometry: square, purpose: 'equal-area' });
    expect(proposals.length).toBeGreaterThanOrEqual(6);
    // Unref'd as it is, the running worker still counts its messaging ports among the active resources.
    expect(messagePorts()).toBeGreaterThan(before);
    await closeSharedEngineThread(services);
    expect(services.engineThread).toBeUndefined();
    expect(messagePorts()).toBe(before);
    // Closing twice, or with no thread ever started, is harmless.
    await closeSharedEngineThread(services);
  }, 60_000);
});
