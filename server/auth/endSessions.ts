import type { EntityManager } from 'typeorm';

/**
 * Deletes the stored sessions of one account (connect-pg-simple's `session` table; passport keeps
 * the user id in sess.passport.user), except `keepSid` when given. Runs in the caller's transaction.
 */
export async function endSessionsOf(em: EntityManager, userId: string, keepSid?: string): Promise<number> {
  const [, count] = await em.query(
    `DELETE FROM session WHERE sess->'passport'->>'user' = $1 AND ($2::varchar IS NULL OR sid <> $2)`,
    [userId, keepSid ?? null],
  );
  return Number(count ?? 0);
}
