/** `npm run build:kernel`: regenerate src/core/physics/loop-field-kernel.ts from its .wat. */
import { readFileSync, writeFileSync } from 'node:fs';
import { compileKernel, kernelModulePath, kernelSourcePath, renderKernelModule } from './loop-kernel-build';

const bytes = await compileKernel(readFileSync(kernelSourcePath, 'utf8'));
writeFileSync(kernelModulePath, renderKernelModule(bytes));
process.stdout.write(`${kernelModulePath}: ${bytes.length} bytes of WebAssembly\n`);
