/** `npm run build:wasm`: rebuild the embedded WebAssembly kernels (scripts/wasm-kernel-build.ts). */
import { writeFileSync } from 'node:fs';
import { compileWasmKernel, renderGeneratedModule, WASM_KERNELS } from './wasm-kernel-build.js';

for (const kernel of WASM_KERNELS) {
  const bytes = await compileWasmKernel(kernel);
  writeFileSync(kernel.generated, renderGeneratedModule(kernel, bytes));
  console.log(`wrote ${kernel.generated} (${bytes.length} bytes of WebAssembly from ${kernel.source})`);
}
