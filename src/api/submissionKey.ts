import { useRef } from 'react';

/** A random Idempotency-Key (getRandomValues works on plain http too, unlike randomUUID). */
export function newSubmissionKey(): string {
  const bytes = crypto.getRandomValues(new Uint8Array(16));
  return Array.from(bytes, (b) => b.toString(16).padStart(2, '0')).join('');
}

/**
 * One key per submission of a form: a double click sends the same key twice, so the server makes
 * one object; once an answer has come back, the next submission gets a fresh key.
 */
export function useSubmissionKey(): { current: () => string; renew: () => void } {
  const key = useRef<string | null>(null);
  return {
    current: () => (key.current ??= newSubmissionKey()),
    renew: () => {
      key.current = null;
    },
  };
}
