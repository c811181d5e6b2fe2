import type { EventEmitter } from 'node:events';

/**
 * Logs a lost connection once, then at most once a minute while it stays lost, and once when
 * it is back — instead of one line per retry (ioredis retries many times a second).
 */
export function logOutages(emitter: EventEmitter, name: string, log = console, quietMs = 60_000): void {
  let downSince = 0;
  let lastLine = 0;
  let suppressed = 0;
  emitter.on('error', (err: Error) => {
    const now = Date.now();
    if (!downSince) {
      downSince = lastLine = now;
      log.error(`[${name}] Redis unreachable: ${err.message}. Retrying; the next lines come once a minute at most.`);
    } else if (now - lastLine >= quietMs) {
      log.error(`[${name}] Redis still unreachable after ${Math.round((now - downSince) / 1000)} s (${suppressed} more errors): ${err.message}`);
      lastLine = now;
      suppressed = 0;
    } else suppressed++;
  });
  emitter.on('ready', () => {
    if (!downSince) return;
    log.log(`[${name}] Redis reachable again after ${Math.round((Date.now() - downSince) / 1000)} s`);
    downSince = 0;
    suppressed = 0;
  });
}
