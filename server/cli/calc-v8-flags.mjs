/**
 * A command is one short process, so V8 is told to wait longer before it optimises a function
 * (its profiler budget about 9 times the default of 67,584). Left as it is, the optimising compiler
 * spends a quarter of a `calc plan` run's CPU on functions that run only a few more times; the
 * engine's code and output are the same. Measured on the 24-level building (2 cores): CPU
 * 1.25 → 0.93 s and wall 0.88 → 0.78 s; on the same building with every level different (24 level
 * designs, a 1.4 s run), CPU 2.2 → 1.7 s and wall 1.45 → 1.3 s. The server keeps V8's defaults.
 */
export const CALC_V8_FLAGS = '--interrupt-budget=600000';
