/**
 * A finding that bears on how far the verdict can be trusted, worded for the reader, with the
 * experiment or check that would remove it. Produced by the diagnostics and pattern checks, read by
 * the verdict (src/evidence/verdict.ts).
 */
export interface Caveat {
  code: string;
  message: string;
  /** true when the caveat forbids a decisive call */
  blocking: boolean;
  /** experiment or action that would remove it */
  suggestion?: string;
  /** true when its suggestion should come before the general ones (it is the first thing to fix) */
  leading?: boolean;
  /** when it blocks: the sentence that should lead the verdict instead of the usual headline */
  headline?: string;
}

/** Caveat code of the activation check: the no-inhibition verdict then drops the "test higher [I]" advice. */
export const ACTIVATION_CODE = 'activation';
