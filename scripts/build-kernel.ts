/** `npm run build:kernel`: compiles the march kernel and writes the module that carries its bytes. */
import { writeFileSync } from 'node:fs';
import { compileKernel, KERNEL_MODULE, kernelModuleText } from './lib/compile-kernel';

const binary = await compileKernel();
writeFileSync(KERNEL_MODULE, kernelModuleText(binary));
console.log(`${KERNEL_MODULE}: ${binary.length} bytes of WebAssembly`);
