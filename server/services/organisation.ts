import type { EntityManager } from 'typeorm';
import PDFDocument from 'pdfkit';
import { dataSource } from '../db/dataSource';
import { HttpError } from '../http/errors';
import type { OrganisationBody } from '../../shared/schemas/organisation';
import { audit } from './audit';

/** Shown on a report when no administrator has filled in the organisation setting yet. */
export const ORGANISATION_NOT_SET = 'Consultancy name not set (Administration, Organisation)';

/** The consultancy's name and address from the organisation setting (one row, id 1). */
export async function loadOrganisationText(em: EntityManager): Promise<{ name: string; address: string }> {
  const [row] = await em.query('SELECT name, address FROM organisation WHERE id = 1');
  return row ? { name: row.name, address: row.address } : { name: ORGANISATION_NOT_SET, address: '' };
}

export async function getOrganisation() {
  const [row] = await dataSource.query('SELECT name, address, logo_type, updated_at FROM organisation WHERE id = 1');
  return row ? { name: row.name as string, address: row.address as string, logoType: row.logo_type as string | null, updatedAt: row.updated_at as Date } : null;
}

export async function loadLogo(): Promise<{ data: Buffer; type: string } | null> {
  const [row] = await dataSource.query('SELECT logo, logo_type FROM organisation WHERE id = 1 AND logo IS NOT NULL');
  return row ? { data: row.logo, type: row.logo_type } : null;
}

export async function saveOrganisation(actorId: string, body: OrganisationBody): Promise<void> {
  await dataSource.transaction(async (em) => {
    await em.query(
      `INSERT INTO organisation (id, name, address) VALUES (1, $1, $2)
       ON CONFLICT (id) DO UPDATE SET name = EXCLUDED.name, address = EXCLUDED.address, updated_at = now()`,
      [body.name, body.address],
    );
    await audit(em, { actorId, action: 'organisation.update', objectType: 'organisation', detail: { name: body.name } });
  });
}

/** PNG or JPEG by its first bytes (PNG: ISO/IEC 15948 signature; JPEG: SOI marker FF D8 then a marker FF). */
export function logoTypeOf(data: Buffer): 'image/png' | 'image/jpeg' | null {
  if (data.subarray(0, 8).equals(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]))) return 'image/png';
  if (data[0] === 0xff && data[1] === 0xd8 && data[2] === 0xff) return 'image/jpeg';
  return null;
}

export async function saveLogo(actorId: string, data: Buffer): Promise<'image/png' | 'image/jpeg'> {
  const type = logoTypeOf(data);
  if (!type) throw new HttpError(422, 'invalid_logo', 'The logo must be a PNG or JPEG image (the file does not start like one).', [{ path: 'file', message: 'not a PNG or JPEG file' }]);
  // The PDF library must be able to embed it, or every later report would fail.
  try {
    (new PDFDocument() as unknown as { openImage(src: Buffer): unknown }).openImage(data);
  } catch (err) {
    throw new HttpError(422, 'invalid_logo', `The logo image could not be read: ${(err as Error).message}`, [{ path: 'file', message: 'unreadable image' }]);
  }
  await dataSource.transaction(async (em) => {
    // TypeORM answers UPDATE … RETURNING with [rows, count] (server/db/returning.ts).
    const [rows] = await em.query('UPDATE organisation SET logo = $1, logo_type = $2, updated_at = now() WHERE id = 1 RETURNING id', [data, type]);
    if (!rows.length) throw new HttpError(409, 'organisation_not_set', 'Save the consultancy name first, then its logo.');
    await audit(em, { actorId, action: 'organisation.logo', objectType: 'organisation', detail: { type, bytes: data.length } });
  });
  return type;
}
