import { dataSource } from '../db/dataSource';

/** The pick sets of a line, newest first, with their latest revision and how many picks it excludes. */
export async function listPickSetSummaries(lineId: string) {
  const rows = await dataSource.query(
    `SELECT s.id, s.file_name, s.size_bytes, s.created_at, s.created_by, u.name AS created_by_name, s.shot_count, s.pick_count,
            r.number AS revision, jsonb_array_length(r.exclusions) AS excluded,
            s.retired_at, s.retire_reason, ru.name AS retired_by_name
     FROM pick_sets s
     LEFT JOIN users u ON u.id = s.created_by
     LEFT JOIN users ru ON ru.id = s.retired_by
     JOIN LATERAL (SELECT number, exclusions FROM pick_set_revisions WHERE pick_set_id = s.id ORDER BY number DESC LIMIT 1) r ON true
     WHERE s.line_id = $1 ORDER BY s.created_at DESC`,
    [lineId],
  );
  return rows.map((r: Record<string, never>) => ({
    id: r.id, fileName: r.file_name, sizeBytes: r.size_bytes, createdAt: r.created_at,
    createdBy: r.created_by ? { id: r.created_by, name: r.created_by_name } : null,
    shots: r.shot_count, picks: r.pick_count, revision: r.revision, excluded: r.excluded,
    retired: r.retired_at ? { at: r.retired_at, by: r.retired_by_name ?? null, reason: r.retire_reason } : null,
  }));
}
