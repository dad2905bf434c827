/** Version of the engine's numbers: bump when any reported figure can change for the same input. */
export const ENGINE_VERSION = '1.0.0';
