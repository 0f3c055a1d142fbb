// Parts of a build: every member reads; owner and crew add, edit, remove, bulk-change and import.
import express, { Router, type Request } from 'express';
import { bulkPartsRequest, createPartRequest, updatePartRequest } from '../../../shared/api/parts';
import { ANY_MEMBER, buildRole, em, isUuid, membershipOf } from '../http/build-access';
import { NotFound, ValidationFailed } from '../http/errors';
import { sendList } from '../http/list-cache';
import { multipartUpload } from '../http/uploads';
import { validBody } from '../http/validate';
import { commitImport, previewDto, previewImport } from './parts-import';
import { bulkUpdateParts, createPart, deletePart, listParts, partDto, updatePart } from './parts.service';

const MAX_CSV_BYTES = 2 * 1024 * 1024;
const EDITORS = ['owner', 'crew'] as const;

/** The CSV arrives as a text body or as the multipart field "file". */
function csvText(req: Request): string {
  if (req.file) return req.file.buffer.toString('utf8');
  if (typeof req.body === 'string' && req.body.trim()) return req.body;
  throw new ValidationFailed({ file: 'Attach a CSV file (field "file") or send the CSV as the request body.' });
}

/** Mounted under /api/builds/:buildId. */
export function partsRoutes(): Router {
  const router = Router({ mergeParams: true });

  router.get('/parts', buildRole(...ANY_MEMBER), async (req, res) => {
    const build = membershipOf(res).build;
    const systemId = typeof req.query.systemId === 'string' && isUuid(req.query.systemId) ? req.query.systemId : undefined;
    const status = typeof req.query.status === 'string' ? req.query.status : undefined;
    const filter = { systemId, status };
    await sendList(res, 'parts', filter, async () => ({ parts: await listParts(em(), build, filter) }));
  });

  router.post('/parts', buildRole(...EDITORS), validBody(createPartRequest), async (req, res) => {
    const build = membershipOf(res).build;
    res.status(201).json(partDto(await createPart(em(), build, req.body), build.currency));
  });

  router.post('/parts/bulk', buildRole(...EDITORS), validBody(bulkPartsRequest), async (req, res) => {
    const build = membershipOf(res).build;
    const parts = await bulkUpdateParts(em(), build, req.body);
    res.json({ parts: parts.map((p) => partDto(p, build.currency)) });
  });

  router.post(
    '/parts/import',
    buildRole(...EDITORS),
    multipartUpload({
      field: 'file',
      maxFiles: 1,
      maxBytes: MAX_CSV_BYTES,
      tooLarge: `The CSV file is larger than ${MAX_CSV_BYTES / 1024 / 1024} MB. Split it, or import fewer rows at a time.`,
      wrongField: 'Send one CSV file, in the field "file".',
    }),
    express.text({ type: ['text/csv', 'text/plain'], limit: MAX_CSV_BYTES }),
    async (req, res) => {
      const build = membershipOf(res).build;
      const text = csvText(req);
      if (req.query.commit === 'true') {
        res.status(201).json(await commitImport(em(), build, text, req.query.dropRejected === 'true'));
      } else {
        res.json(previewDto(await previewImport(em(), build, text)));
      }
    },
  );

  router.patch('/parts/:partId', buildRole(...EDITORS), validBody(updatePartRequest), async (req, res) => {
    if (!isUuid(req.params.partId)) throw new NotFound('That part');
    const build = membershipOf(res).build;
    res.json(partDto(await updatePart(em(), build, String(req.params.partId), req.body), build.currency));
  });

  router.delete('/parts/:partId', buildRole(...EDITORS), async (req, res) => {
    if (!isUuid(req.params.partId)) throw new NotFound('That part');
    await deletePart(em(), membershipOf(res).build, String(req.params.partId));
    res.status(204).end();
  });

  return router;
}
