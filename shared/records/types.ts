/** A position read from a record, in metres (feet and other units converted on reading). */
export interface RecordPoint {
  x: number;
  y: number | null;
  z: number | null;
}

/** One trace as read: the stored samples, untouched, and what its headers say about them. */
export interface RecordTrace {
  /** 0-based order in the file. */
  index: number;
  /** CHANNEL_NUMBER (SEG-2) or the trace number within the field record (SEG-Y); else index + 1. */
  channel: number;
  /** The stored sample values (integers exact), before any descaling. */
  samples: Float64Array;
  /** Multiply stored samples by this for the instrument's units (SEG-2 DESCALING_FACTOR; 1 where absent). */
  descale: number;
  /** Seconds between samples. */
  sampleInterval: number;
  /** Time of the first sample after the shot, seconds (negative: pre-trigger). */
  delay: number;
  receiver: RecordPoint | null;
  source: RecordPoint | null;
  /** Number of summed shots (SEG-2 STACK, SEG-Y vertical sum), null when absent. */
  stack: number | null;
  /** Marked dead in its header (SEG-Y trace identification code 2); the picker also finds dead traces itself. */
  markedDead: boolean;
  /** Every keyword of the trace as read (SEG-2 trace descriptor strings, or named SEG-Y trace header fields). */
  keywords: Record<string, string>;
}

export interface SeismicRecord {
  format: 'seg2' | 'segy';
  /** SEG-2 revision number, or SEG-Y revision as "1.0" / "2.0". */
  revision: string;
  /** 'little' or 'big': the byte order the file was written in. */
  byteOrder: 'little' | 'big';
  traces: RecordTrace[];
  /** File-level keywords (SEG-2 file descriptor strings; SEG-Y binary header fields by name). */
  keywords: Record<string, string>;
  /** SEG-2 NOTE lines, or the SEG-Y textual header(s) as text. */
  notes: string[];
  /** ACQUISITION_DATE + ACQUISITION_TIME (SEG-2) or the first trace's date (SEG-Y), ISO 8601 without zone; null if absent or unreadable. */
  acquired: string | null;
}
