import { dataSource } from './dataSource';

/**
 * Rows of an UPDATE … RETURNING. TypeORM's PostgreSQL driver answers such a statement with
 * [rows, affectedCount] instead of the rows a SELECT gives.
 */
export async function updateReturning<T>(sql: string, params: unknown[]): Promise<T[]> {
  const result = await dataSource.query(sql, params);
  return (Array.isArray(result[0]) ? result[0] : result) as T[];
}
