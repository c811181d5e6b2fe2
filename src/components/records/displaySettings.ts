/** How the record view shows traces; the page keeps one set for every record, so records compare alike. */
export interface DisplaySettings {
  mode: 'wiggle' | 'density' | 'both';
  normalise: 'trace' | 'record';
  /** AGC window, ms; 0: off. */
  agcMs: number;
  /** Band-pass corners, Hz; null: that side off. */
  lowHz: number | null;
  highHz: number | null;
  /** Amplitude 1 spans this many trace spacings. */
  gain: number;
  /** Largest swing in trace spacings; null: unclipped. */
  clip: number | null;
  /** Reduction velocity, m/s: display time = time − offset / velocity; null: true time. */
  reduceVelocity: number | null;
  /** Move a clicked pick to the onset (AIC) near the click. */
  snapClicks: boolean;
}

export const DEFAULT_DISPLAY: DisplaySettings = {
  mode: 'wiggle',
  normalise: 'trace',
  agcMs: 0,
  lowHz: null,
  highHz: null,
  gain: 1.5,
  clip: 1,
  reduceVelocity: null,
  snapClicks: false,
};
