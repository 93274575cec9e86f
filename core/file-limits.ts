/**
 * The one size limit of a design file, wherever it comes in: the command line's input file (also a pipe or a
 * device), the page's upload and the server's check of it. A design file is a few kilobytes; the limit only
 * stops something that cannot be a design (a log, a video, an endless device) before it is read whole.
 */
export const DESIGN_FILE_MAX_BYTES = 2 * 1024 * 1024;

/** The limit as a person reads it ("2 MiB"). */
export const DESIGN_FILE_MAX_TEXT = `${DESIGN_FILE_MAX_BYTES / (1024 * 1024)} MiB`;
