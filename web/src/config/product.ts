export const PRODUCT_NAME = 'Shadowloop';

export const PLANT_NAME = 'Quillmere Water Reclamation Works';

export const PRODUCT_SUMMARY =
  "Shadowloop runs each control loop's state-space model as a live twin beside the real loop, compares its predictions with the plant's readings, and alerts the on-call engineer when the plant stops behaving like its model.";

export const ADVISORY_CAUTION = [
  "Shadowloop is an advisory monitoring tool. It is not a safety instrumented system and does not replace the plant's alarm system, interlocks or operating procedures.",
  "Act on its alerts only within the site's procedures; model changes go through the site's management-of-change process and are reviewed by a qualified control engineer.",
] as const;

export const ADVISORY_CAUTION_SHORT =
  'Advisory monitoring only — not a safety system; it does not replace alarms, interlocks or procedures.';

declare const __SHADOWLOOP_VERSION__: string | undefined;

export const APP_VERSION = typeof __SHADOWLOOP_VERSION__ === 'string' ? __SHADOWLOOP_VERSION__ : 'development build';

/** Beside every forecast and move preview: what the model's what-if is, and what it is not. */
export const MOVE_PREVIEW_CAUTION =
  "Advisory: this is the model's what-if, not a setpoint change — nothing is sent to the plant. Act only within the site's operating procedures.";
