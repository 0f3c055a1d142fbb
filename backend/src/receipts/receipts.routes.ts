// Receipts of a build: upload, list, view (with the document and page images), correct, assign lines, file.
// Every member reads; owner and crew upload and edit (crew until filed); cores change state in one click; returns are listed.
// An upload may carry an Idempotency-Key (upload-idempotency.ts): a repeated capture answers the receipts it made.
import { Router, type Response } from 'express';
import { pipeline } from 'node:stream/promises';
import {
  createLineRequest,
  fileReceiptRequest,
  MAX_UPLOAD_BYTES,
  MAX_UPLOAD_FILES,
  mergeLinesRequest,
  splitLineRequest,
  updateCoreRequest,
  updateLineRequest,
  updateReceiptRequest,
} from '../../../shared/api/receipts';
import { RECEIPT_STATES, REVIEW_STATES, type ReceiptState, type ReviewState } from '../../../shared/enums';
import { ANY_MEMBER, buildRole, em, isUuid, membershipOf } from '../http/build-access';
import { NotFound, ValidationFailed } from '../http/errors';
import { sendList } from '../http/list-cache';
import { multipartUpload } from '../http/uploads';
import { parseInput, validBody } from '../http/validate';
import { dateRangeQuery } from '../../../shared/api/dates';
import type { JobQueue } from '../jobs/queue';
import type { ObjectStore } from '../storage/object-store';
import { listCores, updateCore } from './cores.service';
import { listReturns } from './returns.service';
import { searchLines } from './line-search';
import { receiptDto, lineDto } from './receipt-dto';
import { sendReceipt } from './send-receipt';
import { fileReceipt, reopenReceipt } from './receipt-filing';
import { addLine, deleteLine, mergeLines, splitLine, updateLine } from './receipt-lines.service';
import { createReceipts, findReceipt, listReceipts, updateReceipt, type UploadedDocument } from './receipts.service';
import { UnreadableDocumentError } from './reading/sniff';
import { checkUpload } from './upload-check';
import { claimUploadKey, idempotencyKeyOf, recordUploadReceipts, uploadContentSha256 } from './upload-idempotency';
import type { Receipt } from './receipt.entity';

const EDITORS = ['owner', 'crew'] as const;

function id(value: unknown, what: string): string {
  if (!isUuid(value)) throw new NotFound(what);
  return value;
}

/** Mounted under /api/builds/:buildId. */
export function receiptsRoutes(deps: { store: ObjectStore; queue: JobQueue }): Router {
  const router = Router({ mergeParams: true });
  const receiptOf = async (res: Response, receiptId: unknown) => findReceipt(em(), membershipOf(res).build, id(receiptId, 'That receipt'));

  router.get('/receipts', buildRole(...ANY_MEMBER), async (req, res) => {
    const state = req.query.state;
    if (state !== undefined && !RECEIPT_STATES.includes(state as ReceiptState)) throw new ValidationFailed({ state: `Choose one of: ${RECEIPT_STATES.join(', ')}.` });
    const review = req.query.review;
    if (review !== undefined && !REVIEW_STATES.includes(review as ReviewState)) throw new ValidationFailed({ review: `Choose one of: ${REVIEW_STATES.join(', ')}.` });
    const systemId = req.query.systemId === undefined ? undefined : id(req.query.systemId, 'That system');
    const { from, to } = parseInput(dateRangeQuery, { from: req.query.from, to: req.query.to });
    const filter = {
      state: state as ReceiptState | undefined,
      vendor: typeof req.query.vendor === 'string' ? req.query.vendor : undefined,
      from,
      to,
      systemId,
      review: review as ReviewState | undefined,
    };
    await sendList(res, 'receipts', filter, async () => ({ receipts: await listReceipts(em(), membershipOf(res).build, filter) }));
  });

  router.post(
    '/receipts',
    buildRole(...EDITORS),
    multipartUpload({
      field: 'files',
      maxFiles: MAX_UPLOAD_FILES,
      maxBytes: MAX_UPLOAD_BYTES,
      tooLarge: `A file is larger than ${MAX_UPLOAD_BYTES / 1024 / 1024} MB. Send a smaller photo or PDF.`,
      wrongField: `Send at most ${MAX_UPLOAD_FILES} files at once, in the field "files".`,
    }),
    async (req, res) => {
      const idempotencyKey = idempotencyKeyOf(req);
      const files = (req.files as Express.Multer.File[] | undefined) ?? [];
      if (files.length === 0) throw new ValidationFailed({ files: 'Attach at least one photo or PDF of a receipt.' });
      const documents: UploadedDocument[] = [];
      const fields: Record<string, string> = {};
      for (const [index, file] of files.entries()) {
        try {
          documents.push({ originalFilename: file.originalname, bytes: file.buffer, sniffed: await checkUpload(file.buffer) });
        } catch (error) {
          if (!(error instanceof UnreadableDocumentError)) throw error;
          fields[`files.${index}`] = `${file.originalname}: ${error.message}`;
        }
      }
      // All or nothing, so a person never wonders which of their photos made it.
      if (Object.keys(fields).length) throw new ValidationFailed(fields, Object.values(fields).join(' '));
      const membership = membershipOf(res);
      const claim = idempotencyKey
        ? await claimUploadKey(em(), membership.build, req.user!, idempotencyKey, uploadContentSha256(files.map((file) => file.buffer)))
        : undefined;
      let receipts: Receipt[];
      if (claim && !claim.claimed) {
        // A repeat answers as the first request did (201, the same receipts as they are now) and stores nothing.
        receipts = [];
        for (const receiptId of claim.receiptIds) receipts.push(await findReceipt(em(), membership.build, receiptId));
      } else {
        receipts = await createReceipts(em(), deps, membership.build, req.user!, documents);
        if (claim) await recordUploadReceipts(em(), claim.keyId, receipts.map((receipt) => receipt.id));
      }
      const dtos = [];
      for (const receipt of receipts) dtos.push(await receiptDto(em(), receipt, membership.role));
      res.status(201).json({ receipts: dtos });
    },
  );

  router.get('/receipts/:receiptId', buildRole(...ANY_MEMBER), async (req, res) => {
    await sendReceipt(res, (await receiptOf(res, req.params.receiptId)).id);
  });

  router.get('/receipts/:receiptId/document', buildRole(...ANY_MEMBER), async (req, res) => {
    const receipt = await receiptOf(res, req.params.receiptId);
    const object = await deps.store.stream(receipt.documentKey);
    res.setHeader('Content-Type', receipt.contentType);
    // A PDF can carry script and forms, a mailed message HTML: both are downloaded, never opened as a page of ours, and
    // sandboxed if a browser shows them anyway. Photos stay inline for the check screen.
    const download = !receipt.contentType.startsWith('image/');
    res.setHeader('Content-Disposition', `${download ? 'attachment' : 'inline'}; filename="${receipt.originalFilename.replace(/[^\w.-]+/g, '_')}"`);
    if (download) res.setHeader('Content-Security-Policy', 'sandbox');
    res.setHeader('Cache-Control', 'private, max-age=3600');
    // pipeline, not pipe: a store failure or a client gone mid-way destroys both ends instead of leaving one open.
    await pipeline(object.body, res);
  });

  router.get('/receipts/:receiptId/pages/:page', buildRole(...ANY_MEMBER), async (req, res) => {
    const receipt = await receiptOf(res, req.params.receiptId);
    const page = receipt.pageImages[Number.parseInt(String(req.params.page), 10)];
    if (!page) throw new NotFound('That page');
    const object = await deps.store.stream(page.key);
    res.setHeader('Content-Type', 'image/png');
    res.setHeader('Cache-Control', 'private, max-age=3600');
    await pipeline(object.body, res);
  });

  router.patch('/receipts/:receiptId', buildRole(...EDITORS), validBody(updateReceiptRequest), async (req, res) => {
    const receipt = await receiptOf(res, req.params.receiptId);
    await updateReceipt(em(), receipt, req.user!, membershipOf(res).role, req.body);
    await sendReceipt(res, receipt.id);
  });

  router.post('/receipts/:receiptId/lines', buildRole(...EDITORS), validBody(createLineRequest), async (req, res) => {
    const receipt = await receiptOf(res, req.params.receiptId);
    const line = await addLine(em(), receipt, req.user!, membershipOf(res).role, req.body);
    res.status(201).json(lineDto(line, receipt.build.currency));
  });

  router.patch('/receipts/:receiptId/lines/:lineId', buildRole(...EDITORS), validBody(updateLineRequest), async (req, res) => {
    const receipt = await receiptOf(res, req.params.receiptId);
    const line = await updateLine(em(), receipt, id(req.params.lineId, 'That line'), req.user!, membershipOf(res).role, req.body);
    res.json(lineDto(line, receipt.build.currency));
  });

  router.delete('/receipts/:receiptId/lines/:lineId', buildRole(...EDITORS), async (req, res) => {
    const receipt = await receiptOf(res, req.params.receiptId);
    await deleteLine(em(), receipt, id(req.params.lineId, 'That line'), req.user!, membershipOf(res).role);
    res.status(204).end();
  });

  router.post('/receipts/:receiptId/lines/:lineId/split', buildRole(...EDITORS), validBody(splitLineRequest), async (req, res) => {
    const receipt = await receiptOf(res, req.params.receiptId);
    await splitLine(em(), receipt, id(req.params.lineId, 'That line'), req.user!, membershipOf(res).role, req.body);
    await sendReceipt(res, receipt.id);
  });

  router.post('/receipts/:receiptId/lines/merge', buildRole(...EDITORS), validBody(mergeLinesRequest), async (req, res) => {
    const receipt = await receiptOf(res, req.params.receiptId);
    await mergeLines(em(), receipt, req.body.lineIds, req.user!, membershipOf(res).role);
    await sendReceipt(res, receipt.id);
  });

  router.post('/receipts/:receiptId/file', buildRole(...EDITORS), validBody(fileReceiptRequest), async (req, res) => {
    const receipt = await receiptOf(res, req.params.receiptId);
    await fileReceipt(em(), receipt, req.user!, membershipOf(res).role, req.body);
    await sendReceipt(res, receipt.id);
  });

  router.post('/receipts/:receiptId/reopen', buildRole('owner'), async (req, res) => {
    const receipt = await receiptOf(res, req.params.receiptId);
    await reopenReceipt(em(), receipt, req.user!);
    await sendReceipt(res, receipt.id);
  });

  router.get('/receipt-lines', buildRole(...ANY_MEMBER), async (req, res) => {
    const query = typeof req.query.q === 'string' ? req.query.q : '';
    if (query.trim().length < 2) throw new ValidationFailed({ q: 'Type at least two characters to search.' });
    const excludeReceiptId = req.query.excludeReceiptId === undefined ? undefined : id(req.query.excludeReceiptId, 'That receipt');
    res.json({ lines: await searchLines(em(), membershipOf(res).build, query, excludeReceiptId) });
  });

  router.get('/cores', buildRole(...ANY_MEMBER), async (_req, res) => {
    res.json({ cores: await listCores(em(), membershipOf(res).build) });
  });

  router.get('/returns', buildRole(...ANY_MEMBER), async (_req, res) => {
    res.json(await listReturns(em(), membershipOf(res).build));
  });

  router.patch('/cores/:coreId', buildRole(...EDITORS), validBody(updateCoreRequest), async (req, res) => {
    res.json(await updateCore(em(), membershipOf(res).build, id(req.params.coreId, 'That core deposit'), req.user!, req.body));
  });

  return router;
}

