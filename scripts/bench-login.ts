/**
 * Sign-in under a spray: 200 failed sign-ins at once (different e-mails), from one address and
 * from 200 addresses, while one correct sign-in comes from elsewhere. Prints how long the correct
 * one took and what the spray was answered. Addresses from RFC 5737's documentation ranges.
 * With --json one JSON object per line.
 */
import { performance } from 'node:perf_hooks';
import { anonymousAgent, startTestApp } from '../tests/api/support/app';
import { emailOf, PASSWORD, resetWorld } from '../tests/api/support/world';
import { clearLoginLimits } from '../server/auth/loginLimits';

const SPRAY = 200;
const json = process.argv.includes('--json');
const t = await startTestApp();
t.app.set('trust proxy', 1); // as TRUST_PROXY=1: X-Forwarded-For names the caller
await resetWorld();

async function correctSignIn(from: string): Promise<{ ms: number; status: number }> {
  const agent = await anonymousAgent(t.app);
  const start = performance.now();
  const res = await agent.post('/api/auth/login').set('X-CSRF-Token', agent.csrf).set('X-Forwarded-For', from).send({ email: emailOf('lead'), password: PASSWORD });
  return { ms: performance.now() - start, status: res.status };
}

async function spray(name: string, addressOf: (i: number) => string) {
  await clearLoginLimits(t.redis);
  const agent = await anonymousAgent(t.app);
  const start = performance.now();
  const attempts = Array.from({ length: SPRAY }, (_, i) =>
    agent.post('/api/auth/login').set('X-CSRF-Token', agent.csrf).set('X-Forwarded-For', addressOf(i)).send({ email: `nobody-${i}@spray.test`, password: `guess-${i}-x` })
      .then((r) => r), // supertest sends on then(): start every attempt now
  );
  await new Promise((resolve) => setTimeout(resolve, 50)); // the spray is in flight
  const correct = await correctSignIn('198.51.100.9');
  const answers = await Promise.all(attempts);
  const counts: Record<number, number> = {};
  for (const r of answers) counts[r.status] = (counts[r.status] ?? 0) + 1;
  const result = { case: name, spray: SPRAY, correct_status: correct.status, correct_ms: Math.round(correct.ms), spray_total_ms: Math.round(performance.now() - start), spray_answers: counts };
  console.log(json ? JSON.stringify(result) : `${name}: correct sign-in ${correct.status} in ${result.correct_ms} ms; spray answered ${JSON.stringify(counts)} in ${result.spray_total_ms} ms`);
}

const quiet: number[] = [];
for (let i = 0; i < 5; i++) quiet.push((await correctSignIn('198.51.100.9')).ms);
quiet.sort((a, b) => a - b);
console.log(json ? JSON.stringify({ case: 'no-spray', median_ms: Math.round(quiet[2]) }) : `no spray: correct sign-in median ${Math.round(quiet[2])} ms`);
await spray('one-address', () => '203.0.113.7');
await spray('many-addresses', (i) => `10.${i >> 8}.${i & 255}.1`);
await clearLoginLimits(t.redis);
await t.close();
process.exit(0); // an idle pool or sink timer must not keep the benchmark alive
