import { defineConfig } from 'tsup';

// Library entry, CLI entry and worker entries are built as separate ESM files
// so that worker_threads can load them by path from dist/.
export default defineConfig({
  entry: {
    index: 'src/index.ts',
    'cli/main': 'src/cli/main.ts',
    'sampling-worker': 'src/inference/sampling/worker-entry.ts',
  },
  format: ['esm'],
  target: 'node20',
  platform: 'node',
  dts: { entry: { index: 'src/index.ts' } },
  sourcemap: true,
  clean: true,
  splitting: true,
  shims: false,
});
