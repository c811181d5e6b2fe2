import { RecordFormatError } from './errors';

/**
 * Bounds-checked reads from a file's bytes in one byte order. Every read past the end throws a
 * RecordFormatError naming the offset and what was being read, so no reader can run off a
 * truncated file or follow a pointer out of it.
 */
export class ByteReader {
  readonly view: DataView;
  readonly length: number;

  constructor(
    readonly bytes: Uint8Array,
    public littleEndian: boolean,
  ) {
    this.view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
    this.length = bytes.byteLength;
  }

  /** Throws unless `size` bytes from `offset` lie inside the file. */
  need(offset: number, size: number, what: string): void {
    if (!Number.isSafeInteger(offset) || offset < 0 || size < 0 || offset + size > this.length) {
      throw new RecordFormatError(Math.min(Math.max(offset, 0), this.length), `expected ${what} (${size} bytes) but the file ends at byte ${this.length}`);
    }
  }

  u8(offset: number, what: string): number {
    this.need(offset, 1, what);
    return this.view.getUint8(offset);
  }
  u16(offset: number, what: string): number {
    this.need(offset, 2, what);
    return this.view.getUint16(offset, this.littleEndian);
  }
  i16(offset: number, what: string): number {
    this.need(offset, 2, what);
    return this.view.getInt16(offset, this.littleEndian);
  }
  u32(offset: number, what: string): number {
    this.need(offset, 4, what);
    return this.view.getUint32(offset, this.littleEndian);
  }
  i32(offset: number, what: string): number {
    this.need(offset, 4, what);
    return this.view.getInt32(offset, this.littleEndian);
  }
  f64(offset: number, what: string): number {
    this.need(offset, 8, what);
    return this.view.getFloat64(offset, this.littleEndian);
  }
  /** Unsigned 64-bit as a number; throws if it does not fit a safe integer (no file is that large). */
  u64(offset: number, what: string): number {
    this.need(offset, 8, what);
    const v = this.view.getBigUint64(offset, this.littleEndian);
    if (v > BigInt(Number.MAX_SAFE_INTEGER)) throw new RecordFormatError(offset, `${what}: ${v} is larger than any file`);
    return Number(v);
  }
}
