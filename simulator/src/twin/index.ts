/** The stepping service of the live twins (see twin-service.ts). */
export { createTwinService, type TwinService, type TwinServiceDeps } from './twin-service.js';
export { createSampleEmitter, silentEmitter, type SampleEmitter } from './sample-emitter.js';
export {
  DEFAULT_TWIN_OPTIONS,
  twinOptions,
  type ActiveModelSource,
  type TickReport,
  type TwinOptions,
  type TwinOptionsInput,
} from './twin-runtime.js';
export { periodMsOf, slotAtMs } from './slot-clock.js';
