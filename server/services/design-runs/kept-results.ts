/** Schemes whose last result a design worker keeps (a few: each holds its plan's designs and geometry). */
export const KEPT_RESULTS = 3;
/** Largest plan (members) whose result a worker keeps for the next run. */
export const KEPT_RESULT_MAX_MEMBERS = 12_000;
