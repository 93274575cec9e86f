/** The caution shown with every result: page, command line and report. */
export const CAUTION =
  'Engineering estimate only. Brakes must be verified by physical brake testing; ' +
  'local regulations and a licensed inspector decide whether a vehicle may be used on the road.';

/** Shown beside every verdict whose source is only partly verified or recalled from memory. */
export const VERIFY_NOTE = 'verify against the current official text';
