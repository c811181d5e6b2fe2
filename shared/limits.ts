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

/**
 * PLAUSIBLE VALUES — the one table of numeric limits for anything a user types or uploads
 * (pick files, station tables, model files, run options). A value outside its range is refused
 * at the edge with its line/column or JSON path; nothing outside these ranges is ever stored.
 * The ranges are wide on purpose: they catch typos and junk (1e308, 1e-300), not unusual sites.
 *
 * | quantity                    | range                 | why                                                         |
 * |-----------------------------|-----------------------|-------------------------------------------------------------|
 * | x, chainage, source/receiver| −1e7 … +1e7 m         | projected eastings/northings and chainages all fit (a UTM    |
 * |   position, polyline x      |                       | northing is < 1e7 m); from memory                           |
 * | z, elevation                | −12 000 … +9 000 m    | deepest ocean floor ≈ −11 000 m, highest summit ≈ 8 850 m;  |
 * |                             |                       | from memory. A local datum still fits                       |
 * | velocity (layers, grid,     | 50 … 10 000 m/s       | slowest loose soils ≈ 100 m/s, air 330 m/s, fastest crystal- |
 * |   edits)                    |                       | line rock ≈ 7 000 m/s; common practice, no source           |
 * | time_ms (first arrival)     | 0 … 10 000 ms         | a shallow refraction spread records well under 1 s; 10 s    |
 * |                             |                       | is the longest record length in use; common practice        |
 * | sigma_ms (pick uncertainty) | 0.01 … 100 ms         | below a tenth of a typical 0.125 ms sample is not a pick     |
 * |                             |                       | error; above 100 ms the pick carries no information          |
 * | grid spacing dx, dz         | 0.01 … 100 m          | sub-centimetre cells or cells wider than a whole spread are  |
 * |                             |                       | not a refraction model; common practice, no source          |
 * | grid extent                 | every node inside the | the grid's corners are positions and elevations too         |
 * |                             | x and z ranges above  |                                                             |
 */
export interface NumberRange {
  min: number;
  max: number;
  unit: string;
}
/** Positions along the line and plan coordinates (m). */
export const X_RANGE: NumberRange = { min: -1e7, max: 1e7, unit: 'm' };
/** Elevations (m, up positive). */
export const Z_RANGE: NumberRange = { min: -12_000, max: 9_000, unit: 'm' };
/** Seismic velocities (m/s). */
export const VELOCITY_RANGE: NumberRange = { min: 50, max: 10_000, unit: 'm/s' };
/** Picked first-arrival times (ms, at the edge). */
export const TIME_MS_RANGE: NumberRange = { min: 0, max: 10_000, unit: 'ms' };
/** Pick uncertainties (ms, at the edge). */
export const SIGMA_MS_RANGE: NumberRange = { min: 0.01, max: 100, unit: 'ms' };
/** Grid cell sizes dx, dz (m). */
export const SPACING_RANGE: NumberRange = { min: 0.01, max: 100, unit: 'm' };

const show = (n: number): string => n.toLocaleString('en-US', { maximumSignificantDigits: 6 });

/** Null when `value` lies in the range, else a sentence such as "must be between 50 and 10,000 m/s (got 1e+308)". */
export function outOfRange(value: number, range: NumberRange): string | null {
  if (value >= range.min && value <= range.max) return null;
  return `must be between ${show(range.min)} and ${show(range.max)} ${range.unit} (got ${value})`;
}

/**
 * Pick positions farther than this many median station spacings beyond the nearest station get a
 * warning in the pick-set checks (not a refusal): an off-end shot a few stations out is normal,
 * one 10 km off a 100 m spread is a typo. Common practice, no source.
 */
export const FAR_FROM_STATIONS_SPACINGS = 3;

/**
 * FIELD RECORDS (SEG-2 / SEG-Y shot records). One record is one shot on one spread: 12–96 channels
 * of a few thousand samples in the field (common practice, no source). The limits stop hostile or
 * corrupt headers (huge counts, pointers past the end) before anything is allocated; a reader never
 * allocates more samples than the file's bytes can hold.
 */
/** Bytes in one record file (a SEG-Y file of many shots may be read too). */
export const MAX_RECORD_BYTES = 256 * 1024 * 1024;
/** Bytes in one record uploaded to a line (one shot per file; field records are a few MB). */
export const MAX_RECORD_UPLOAD_BYTES = 64 * 1024 * 1024;
/** Traces in one record file. */
export const MAX_RECORD_TRACES = 10_000;
/** Samples in one trace (250 s at 0.25 ms). */
export const MAX_TRACE_SAMPLES = 1_000_000;
/** Samples in one record file, all traces together (128 MB as Float64). */
export const MAX_RECORD_SAMPLES = 16_000_000;
/** Sample intervals (s): 1 µs … 1 s; engineering seismographs record at 0.02–2 ms (common practice, no source). */
export const SAMPLE_INTERVAL_RANGE: NumberRange = { min: 1e-6, max: 1, unit: 's' };
/** Recording delays (s), negative for a pre-trigger: well beyond any refraction record. */
export const RECORD_DELAY_RANGE: NumberRange = { min: -100, max: 100, unit: 's' };
