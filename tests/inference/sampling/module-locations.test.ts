import { existsSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { samplingWorkerEntry, trebleLibraryModule } from '../../../src/inference/sampling/module-locations.js';

describe('module locations for worker threads', () => {
  it('from source, the worker entry is the TypeScript file beside the pool and the library entry is src/index.ts', () => {
    const worker = samplingWorkerEntry();
    expect(worker.typescript).toBe(true);
    expect(existsSync(worker.url)).toBe(true);
    expect(worker.url.pathname.endsWith('/src/inference/sampling/worker-entry.ts')).toBe(true);
    const library = new URL(trebleLibraryModule());
    expect(library.pathname.endsWith('/src/index.ts')).toBe(true);
    expect(existsSync(library)).toBe(true);
  });
});
