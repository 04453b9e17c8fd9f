/** Types for calc-v8-flags.mjs (a plain module, read by the launcher before any TypeScript runs). */
export declare const CALC_V8_FLAGS: string;
