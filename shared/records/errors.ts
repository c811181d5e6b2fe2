/**
 * A field record that cannot be read. The message names the byte offset and what was expected,
 * so a field technician can tell a truncated copy from a file of another kind.
 */
export class RecordFormatError extends Error {
  constructor(
    /** Byte offset in the file where the problem was found (0-based). */
    readonly offset: number,
    /** What was expected there, as a sentence fragment. */
    readonly detail: string,
  ) {
    super(`byte ${offset}: ${detail}`);
    this.name = 'RecordFormatError';
  }
}
