/** Issue 16 item 13: a lost Redis connection is logged once per outage (and once when back), not once per retry. */
import { EventEmitter } from 'node:events';
import { describe, expect, it } from 'vitest';
import { logOutages } from '../../server/queue/outage-log';

describe('logOutages', () => {
  it('writes one line for a burst of errors and one when the connection is back', () => {
    const lines: string[] = [];
    const log = { error: (l: string) => lines.push(l), log: (l: string) => lines.push(l) } as unknown as Console;
    const conn = new EventEmitter();
    logOutages(conn, 'api', log);
    for (let i = 0; i < 500; i++) conn.emit('error', new Error('connect ECONNREFUSED 127.0.0.1:56379'));
    conn.emit('ready');
    conn.emit('error', new Error('connect ECONNREFUSED 127.0.0.1:56379'));
    expect(lines).toHaveLength(3);
    expect(lines[0]).toMatch(/\[api\] Redis unreachable: connect ECONNREFUSED/);
    expect(lines[1]).toMatch(/reachable again/);
  });
});
