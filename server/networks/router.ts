import express, { Router } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { sniffContent } from '../../lib/formats';
import { importRequestSchema, networkListQuerySchema } from '../../lib/schemas/network';
import { requireRoles } from '../auth/require-roles';
import { HttpError } from '../http/errors';
import { parseOr400 } from '../http/validate';
import { diffVersions, importNetwork, listNetworks, networkDetail, versionDetail, type NetworkDeps } from './service';

const idParams = z.object({ networkId: z.coerce.number().int().positive() });
const versionParams = idParams.extend({ version: z.coerce.number().int().positive() });
const diffQuery = z.object({ from: z.coerce.number().int().positive(), to: z.coerce.number().int().positive() });

/** Largest upload accepted; a 20,000-edge CSV is well under 1 MB. */
export const MAX_UPLOAD_BYTES = 16 * 1024 * 1024;

export function networksRouter(deps: NetworkDeps): Router {
  const router = Router();
  const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: MAX_UPLOAD_BYTES, files: 1, fields: 20 } });

  router.get('/networks', requireRoles(), async (req, res) => {
    const q = parseOr400(networkListQuerySchema, req.query, 'query');
    res.json({ networks: await listNetworks(deps.db, q.q, q.sort) });
  });

  // A paste-in import is JSON; an upload is multipart with the same fields beside the file.
  router.post(
    '/networks/import',
    requireRoles('analyst'),
    express.json({ limit: MAX_UPLOAD_BYTES }),
    (req, res, next) => upload.single('file')(req, res, (err: unknown) => next(uploadError(err))),
    async (req, res) => {
      const fields = req.file ? formFields(req.body) : req.body;
      const input = parseOr400(importRequestSchema, { ...fields, fileName: req.file?.originalname ?? fields?.fileName }, 'body');
      const text = req.file ? decodeUpload(req.file.buffer) : input.text;
      if (text === undefined) throw new HttpError(400, 'file-missing', 'Attach a file or paste the edge list.', { file: 'required' });
      res.status(201).json(await importNetwork(deps, req.user!, input, text));
    },
  );

  router.get('/networks/:networkId', requireRoles(), async (req, res) => {
    const { networkId } = parseOr400(idParams, req.params, 'path');
    res.json(await networkDetail(deps.db, networkId));
  });

  router.get('/networks/:networkId/versions/:version', requireRoles(), async (req, res) => {
    const { networkId, version } = parseOr400(versionParams, req.params, 'path');
    res.json(await versionDetail(deps.db, networkId, version));
  });

  router.get('/networks/:networkId/diff', requireRoles(), async (req, res) => {
    const { networkId } = parseOr400(idParams, req.params, 'path');
    const { from, to } = parseOr400(diffQuery, req.query, 'query');
    res.json(await diffVersions(deps.db, networkId, from, to));
  });

  return router;
}

/** Multipart fields arrive as strings; `options` is sent as a JSON string. */
function formFields(body: Record<string, string>): Record<string, unknown> {
  const out: Record<string, unknown> = { ...body };
  if (typeof body.options === 'string' && body.options.trim() !== '') {
    try {
      out.options = JSON.parse(body.options);
    } catch {
      throw new HttpError(400, 'bad-options', 'The options field is not valid JSON.', { options: 'not JSON' });
    }
  }
  return out;
}

/**
 * UTF-8 (with or without BOM). Workbooks, archives and PDFs go on to the
 * parser, which names them; other text in another encoding is refused here,
 * since decoding it loosely would store U+FFFD in place of letters.
 */
function decodeUpload(buffer: Buffer): string {
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(buffer);
  } catch {
    const loose = new TextDecoder('utf-8', { fatal: false }).decode(buffer);
    const utf16 = (buffer[0] === 0xff && buffer[1] === 0xfe) || (buffer[0] === 0xfe && buffer[1] === 0xff);
    if (!utf16 && sniffContent(loose) === 'binary') return loose;
    const bad = loose.indexOf('\uFFFD');
    const line = loose.slice(0, Math.max(bad, 0)).split('\n').length;
    const message = utf16
      ? 'The file is saved as UTF-16 text; save it again as UTF-8 (spreadsheets call it "CSV UTF-8") and import that file'
      : `line ${line}: the file is not UTF-8 text (perhaps Latin-1 or Windows-1252), so letters such as ö would be lost; save it again as UTF-8 and import that file`;
    throw new HttpError(422, 'import-rejected', 'The file was not imported: 1 problem to fix.', undefined, [
      utf16 ? { code: 'wrong-format', message } : { code: 'wrong-format', message, line },
    ]);
  }
}

function uploadError(err: unknown): unknown {
  if (err instanceof multer.MulterError) {
    if (err.code === 'LIMIT_FILE_SIZE') {
      return new HttpError(413, 'too-large', `The file is larger than ${MAX_UPLOAD_BYTES / 1024 / 1024} MB; split it or remove unused columns.`);
    }
    return new HttpError(400, 'bad-upload', `The upload was not accepted: ${err.message}.`);
  }
  return err;
}
