import { Router } from 'express';
import multer from 'multer';
import { HttpError } from '../http/errors';
import { parse } from '../http/parse';
import { authorize } from '../policies/authorize';
import { organisationBody, MAX_LOGO_BYTES } from '../../shared/schemas/organisation';
import { getOrganisation, loadLogo, saveLogo, saveOrganisation } from '../services/organisation';

const logoUpload = multer({ storage: multer.memoryStorage(), limits: { fileSize: MAX_LOGO_BYTES, files: 1, fields: 0 } }).single('file');

/** The consultancy's name, address and logo, printed on every report. */
export function organisationRouter(): Router {
  const r = Router();

  r.get('/organisation', authorize('organisation.read'), async (_req, res) => {
    const org = await getOrganisation();
    res.json(org ? { name: org.name, address: org.address, hasLogo: org.logoType !== null, updatedAt: org.updatedAt } : { name: '', address: '', hasLogo: false, updatedAt: null });
  });

  r.put('/organisation', authorize('organisation.update'), async (req, res) => {
    await saveOrganisation(req.user!.id, parse(organisationBody, req.body));
    const org = (await getOrganisation())!;
    res.json({ name: org.name, address: org.address, hasLogo: org.logoType !== null, updatedAt: org.updatedAt });
  });

  r.get('/organisation/logo', authorize('organisation.read'), async (_req, res) => {
    const logo = await loadLogo();
    if (!logo) throw new HttpError(404, 'no_logo', 'No logo has been uploaded.');
    res.type(logo.type).send(logo.data);
  });

  r.put('/organisation/logo', authorize('organisation.update'), (req, res, next) =>
    logoUpload(req, res, (err: unknown) => {
      if (err instanceof multer.MulterError && err.code === 'LIMIT_FILE_SIZE') return next(new HttpError(413, 'too_large', `The logo is larger than the limit of ${MAX_LOGO_BYTES / 1024} KB.`));
      if (err instanceof multer.MulterError) return next(new HttpError(400, 'bad_upload', `The upload could not be read: ${err.message}. Send one image in the form field "file".`));
      next(err);
    }), async (req, res) => {
    if (!req.file) throw new HttpError(400, 'bad_upload', 'Send the logo as a PNG or JPEG file in the multipart form field "file".');
    res.json({ type: await saveLogo(req.user!.id, req.file.buffer) });
  });

  return r;
}
