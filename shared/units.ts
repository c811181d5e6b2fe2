/** SI inside the code; the trade reads picks in milliseconds. Convert only at the edges. */
export const msToS = (ms: number): number => ms / 1000;
export const sToMs = (s: number): number => s * 1000;
