/** Parsed picks, SI inside: positions in metres, times in seconds (FORMATS.md §2 keeps ms at the file edge). */
export interface Pick {
  /** 1-based line in the source file (or row number for JSON input), for messages. */
  line: number;
  shotId: string;
  sourceX: number;
  /** Elevation (m); null → on the model's ground surface at sourceX. */
  sourceZ: number | null;
  receiverX: number;
  /** Elevation (m); null → on the model's ground surface at receiverX. */
  receiverZ: number | null;
  /** First-arrival time, s. */
  time: number;
  /** Pick uncertainty, s (file default 1.0 ms). */
  sigma: number;
}

export interface ShotSummary {
  shotId: string;
  sourceX: number;
  sourceZ: number | null;
  /** Number of picks of this shot. */
  picks: number;
}

/** A problem in a pick file. `line` is 1-based; `column` is the column NAME as written in the format. */
export interface PickError {
  line: number | null;
  column: string | null;
  message: string;
}

export type PickParseResult = { ok: true; picks: Pick[]; shots: ShotSummary[] } | { ok: false; errors: PickError[] };
