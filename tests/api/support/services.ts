import { execFileSync } from 'node:child_process';

/** Runs functions of scripts/lib/test-services.sh (stop_redis, start_postgres, …) against the test services. */
export const services = (...steps: string[]) =>
  execFileSync('bash', ['-c', `source scripts/lib/test-services.sh && ${steps.join(' && ')}`], { env: process.env, stdio: 'pipe' });
