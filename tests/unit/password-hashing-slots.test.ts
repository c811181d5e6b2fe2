// Issue 16 item 8: password hashing cannot take every libuv thread (the pool has 4 by default,
// Node.js docs "UV_THREADPOOL_SIZE"); at most two scrypt hashes run, the rest wait, and a long
// queue is reported so sign-in can answer 503 instead of waiting.
import { describe, expect, it } from 'vitest';
import { hashingBacklogFull, hashingLoad, hashPassword, MAX_WAITING_HASHES, verifyPassword } from '../../server/auth/password';

const nextTurn = () => new Promise((resolve) => setImmediate(resolve));

describe('scrypt slots', () => {
  it('runs at most two hashes at once and queues the rest', async () => {
    const all = Array.from({ length: 10 }, (_, i) => hashPassword(`password-number-${i}`));
    await nextTurn();
    expect(hashingLoad()).toEqual({ running: 2, waiting: 8 });
    const hashes = await Promise.all(all);
    expect(hashingLoad()).toEqual({ running: 0, waiting: 0 });
    expect(await verifyPassword('password-number-3', hashes[3])).toBe(true);
  });

  it('reports a full backlog once MAX_WAITING_HASHES wait, and not after they are done', async () => {
    expect(hashingBacklogFull()).toBe(false);
    const all = Array.from({ length: MAX_WAITING_HASHES + 2 }, () => verifyPassword('x', 'scrypt$1024$8$1$AAAA$AAAA'));
    await nextTurn();
    expect(hashingBacklogFull()).toBe(true);
    await Promise.all(all);
    expect(hashingBacklogFull()).toBe(false);
  });
});
