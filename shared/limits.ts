/**
 * Documented size limits, shared by validation in the browser, the API and the worker.
 * A 2-million-node grid holds 16 MB of Float64 travel times per shot: large enough for
 * any engineering refraction line at sub-metre spacing, small enough to solve in seconds.
 */
export const MAX_GRID_NODES = 2_000_000;
/** Rows in one pick file (one row per pick). */
export const MAX_PICK_ROWS = 200_000;
/** Bytes in one uploaded pick file. */
export const MAX_PICK_FILE_BYTES = 20 * 1024 * 1024;
/**
 * Shots in one forward run. A spread is shot from 5–25 points and a long roll-along line from a
 * few hundred (common practice, no source); each shot stores one travel-time field (up to 8 MB
 * before compression on the largest grid), so a larger survey is split into runs per spread.
 */
export const MAX_SHOTS_PER_RUN = 300;
