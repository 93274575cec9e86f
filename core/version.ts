/** Lockstep version, printed in results and reports (kept equal to package.json by a test). */
export const LOCKSTEP_VERSION = '0.1.0';
