import { describe, expect, it } from 'vitest';
import { STEP_KERNEL_WASM_BASE64 } from '../simulator/src/engine/step-kernel-wasm.js';
import { assembleStepKernel, kernelModuleSource } from './build-wasm.js';

describe('the stepper kernel bytes', () => {
  it('are what step-kernel.wat assembles to (run `npm run build:wasm` after editing it)', async () => {
    const bytes = await assembleStepKernel();
    expect(STEP_KERNEL_WASM_BASE64).toBe(Buffer.from(bytes).toString('base64'));
    expect(kernelModuleSource(bytes)).toContain(`${bytes.length} bytes`);
  });
});
