import { randomBytes, scrypt as scryptCb, timingSafeEqual } from 'node:crypto';
import { promisify } from 'node:util';
import pLimit from 'p-limit';

const scryptRaw = promisify(scryptCb) as (pw: string, salt: Buffer, len: number, opts: object) => Promise<Buffer>;

// scrypt cost N = 2^15, r = 8, p = 1: the interactive-login parameters recommended in
// RFC 7914 §2 discussion and OWASP's password storage guidance (from memory).
const PARAMS = { N: 1 << 15, r: 8, p: 1, maxmem: 64 * 1024 * 1024 };
const KEY_LENGTH = 32;

/**
 * At most two scrypt hashes at once: libuv's pool has 4 threads, shared with file and DNS work,
 * so a burst of sign-ins cannot take them all. Callers beyond that wait in this queue.
 */
const scryptSlots = pLimit(2);
/** More waiting than this and a sign-in is answered 503 at once instead of queueing (about 2 s of work). */
export const MAX_WAITING_HASHES = 32;
export const hashingBacklogFull = (): boolean => scryptSlots.pendingCount >= MAX_WAITING_HASHES;
/** Hashes running and waiting now (for tests and logs). */
export const hashingLoad = () => ({ running: scryptSlots.activeCount, waiting: scryptSlots.pendingCount });
const scrypt = (pw: string, salt: Buffer, len: number, opts: object) => scryptSlots(() => scryptRaw(pw, salt, len, opts));

/** Format: scrypt$N$r$p$salt(base64)$hash(base64), so parameters can change later. */
export async function hashPassword(password: string): Promise<string> {
  const salt = randomBytes(16);
  const hash = await scrypt(password, salt, KEY_LENGTH, PARAMS);
  return ['scrypt', PARAMS.N, PARAMS.r, PARAMS.p, salt.toString('base64'), hash.toString('base64')].join('$');
}

export async function verifyPassword(password: string, stored: string): Promise<boolean> {
  const [scheme, n, r, p, saltB64, hashB64] = stored.split('$');
  if (scheme !== 'scrypt' || !saltB64 || !hashB64) return false;
  const expected = Buffer.from(hashB64, 'base64');
  const actual = await scrypt(password, Buffer.from(saltB64, 'base64'), expected.length, {
    N: Number(n), r: Number(r), p: Number(p), maxmem: PARAMS.maxmem,
  });
  return timingSafeEqual(actual, expected);
}

/** A hash that matches no password: verified against when the e-mail is unknown, so both paths take the same time. */
let decoy: Promise<string> | undefined;
export const decoyHash = (): Promise<string> => (decoy ??= hashPassword(randomBytes(16).toString('hex')));
