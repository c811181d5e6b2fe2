/**
 * Arguments for worker threads: the parent's own when it was started with tsx (its loader then
 * comes along), otherwise `--import tsx` is added so threads can load .ts files (e.g. under a test runner).
 */
export function workerExecArgv(): string[] {
  const hasTsLoader = process.execArgv.some((a) => /(^|[\\/])tsx([\\/]|$)/.test(a));
  return hasTsLoader ? process.execArgv : [...process.execArgv, '--import', 'tsx'];
}
