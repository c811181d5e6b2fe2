/** Display formats for the checks: ms to 2 decimals, metres to cm, velocities to the m/s. Units go in the column headers. */
const fmt = (digits: number) => new Intl.NumberFormat('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits });
const ms2 = fmt(2);
const whole = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 0 });
const upToCm = new Intl.NumberFormat('en-GB', { minimumFractionDigits: 1, maximumFractionDigits: 2 });

export const showMs = (ms: number) => (Number.isFinite(ms) ? ms2.format(ms) : '—');
/** Seconds (as shared/qc returns them) shown in ms. */
export const showSecondsAsMs = (s: number) => showMs(s * 1000);
export const showMetres = (m: number | null | undefined) => (m === null || m === undefined || !Number.isFinite(m) ? '—' : upToCm.format(m));
export const showVelocity = (v: number) => (Number.isFinite(v) ? whole.format(v) : '—');
export const showR2 = (r2: number) => (Number.isFinite(r2) ? r2.toFixed(3) : '—');
