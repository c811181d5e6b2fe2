/**
 * Excavatability classes from seismic velocity: the velocity at which each harder class begins.
 * Defaults after Weaver, J. M. (1975), "Geological factors significant in the assessment of
 * rippability", The Civil Engineer in South Africa 17(12), 313–316, seismic-velocity column of his
 * rippability rating (values from memory): easy ripping from 450 m/s, hard ripping from 1200, very
 * hard ripping from 1500, extremely hard ripping and blasting from 1850, blasting from 2150. Below
 * 450 m/s "digging" is our own label. Velocity alone only indicates excavatability: rock mass
 * structure, weathering and the plant used decide it, so classes must be confirmed by direct
 * investigation (trial pits, test ripping).
 */
export interface ExcavatabilityClass {
  /** m/s at which this class begins (the first begins at 0). */
  from: number;
  name: string;
}

export const WEAVER_1975: readonly ExcavatabilityClass[] = [
  { from: 0, name: 'digging' },
  { from: 450, name: 'easy ripping' },
  { from: 1200, name: 'hard ripping' },
  { from: 1500, name: 'very hard ripping' },
  { from: 1850, name: 'extremely hard ripping or blasting' },
  { from: 2150, name: 'blasting' },
];

export const EXCAVATABILITY_CAUTION =
  'Excavatability classes from seismic velocity only indicate how the ground may dig; rock structure, weathering and the plant used decide it. Confirm by direct investigation (trial pits, test ripping) before pricing or planning excavation.';

/** Bands as the user sets them: "450:easy ripping,1200:hard ripping,…" (velocities increasing), or a problem. */
export function parseClasses(text: string): ExcavatabilityClass[] | string {
  const parts = text.split(',').map((p) => p.trim()).filter(Boolean);
  const out: ExcavatabilityClass[] = [{ from: 0, name: 'below the first band' }];
  for (const p of parts) {
    const m = /^(\d+(?:\.\d+)?)\s*:\s*(.{1,60})$/.exec(p);
    if (!m) return `"${p.slice(0, 40)}" is not a band: write velocity:name, for example 1200:hard ripping`;
    const from = Number(m[1]);
    if (!(from > out[out.length - 1].from)) return `the bands must start at increasing velocities (${from} m/s after ${out[out.length - 1].from} m/s)`;
    out.push({ from, name: m[2].trim() });
  }
  return out.length > 1 ? out : 'give at least one band';
}
