/**
 * What an inversion needs from its picks before it is worth queuing. A tomographic model is
 * constrained by rays crossing from different directions: one shot gives one fan of rays and no
 * crossings, and a handful of picks cannot hold even the 1-D gradient start (two parameters) with
 * any redundancy. Common practice, no source; the numbers are deliberately low (they catch a wrong
 * pick set or an over-eager exclusion, not a thin survey).
 */

/** Picks left after the revision's exclusions. */
export const MIN_INVERSION_PICKS = 10;
/** Distinct shots among them. */
export const MIN_INVERSION_SHOTS = 2;

export interface InversionPickIssue {
  /** 'too_few_picks' | 'one_shot' */
  code: 'too_few_picks' | 'one_shot';
  message: string;
}

/** The first rule the used picks break, or null. `shotIds`: the shot of every pick left after exclusions. */
export function checkInversionPicks(shotIds: readonly string[], excluded: number): InversionPickIssue | null {
  const n = shotIds.length;
  if (n < MIN_INVERSION_PICKS) {
    const picks = `${n} pick${n === 1 ? '' : 's'}`;
    const why = n === 0 && excluded > 0
      ? 'every pick is excluded in this revision'
      : excluded ? `${picks} ${n === 1 ? 'is' : 'are'} left after ${excluded} exclusion${excluded === 1 ? '' : 's'}` : `the pick set has ${picks}`;
    return { code: 'too_few_picks', message: `An inversion needs at least ${MIN_INVERSION_PICKS} picks; ${why}.` };
  }
  const shots = new Set(shotIds).size;
  if (shots < MIN_INVERSION_SHOTS) {
    return { code: 'one_shot', message: `All ${n} picks belong to one shot (${shotIds[0]}); an inversion needs picks from at least ${MIN_INVERSION_SHOTS} shots, so that rays cross.` };
  }
  return null;
}
