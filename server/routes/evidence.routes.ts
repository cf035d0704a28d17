import { Router } from 'express';
import { pipeline } from 'node:stream/promises';
import { requires } from '../middlewares/authorize';
import { parseBody, parseParams, parseQuery } from '../lib/validate';
import { IdParamSchema } from '../../shared/schemas/common';
import { EvidenceListQuerySchema, EvidenceOwnerSchema, EvidenceSupersedeSchema } from '../../shared/schemas/evidence';
import type { AppDeps } from '../app-deps';
import { createEvidenceUpload } from '../middlewares/evidence-upload';
import { addEvidence, listEvidence, openEvidence, removeTempFiles, supersedeEvidence, type Actor } from '../services/evidence.service';
import type { HashedUpload } from '../storage/hashing-disk-engine';
import type { Request, Response } from 'express';

const actorOf = (res: Response): Actor => ({ user: res.locals.user!, ability: res.locals.ability! });

export function evidenceRoutes(deps: AppDeps): Router {
  const router = Router();
  const upload = createEvidenceUpload(deps.config);

  router.get('/evidence', requires.can('read', 'Evidence'), async (req, res) => {
    res.json(await listEvidence(deps, actorOf(res), parseQuery(EvidenceListQuerySchema, req)));
  });

  router.post('/evidence', requires.can('create', 'Evidence'), upload, async (req, res) => {
    const files = (req.files ?? []) as HashedUpload[];
    try {
      const owner = parseBody(EvidenceOwnerSchema, req);
      const created = await addEvidence(deps, actorOf(res), owner, files);
      res.status(201).json({ items: created, total: created.length });
    } catch (error) {
      // Refused: no row was written, so no file may stay behind.
      await removeTempFiles(files);
      throw error;
    }
  });

  const send = (inline: boolean) => async (req: Request, res: Response) => {
    const { id } = parseParams(IdParamSchema, req);
    const { file, stream } = await openEvidence(deps, actorOf(res), id, { inline });
    res.setHeader('Content-Type', file.mediaType);
    res.setHeader('Content-Length', String(file.sizeBytes));
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.setHeader('Cache-Control', 'private, no-store');
    res.setHeader('Content-Security-Policy', "default-src 'none'; img-src 'self'; sandbox");
    res.setHeader('X-Evidence-SHA256', file.sha256);
    if (inline) res.setHeader('Content-Disposition', `inline; filename="${file.originalName.replace(/[^\x20-\x7e]|"/g, '_')}"`);
    else res.attachment(file.originalName);
    await pipeline(stream, res);
  };

  router.get('/evidence/:id/download', requires.can('read', 'Evidence'), send(false));
  router.get('/evidence/:id/preview', requires.can('read', 'Evidence'), send(true));

  router.post('/evidence/:id/supersede', requires.can('supersede', 'Evidence'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const input = parseBody(EvidenceSupersedeSchema, req);
    res.json(await supersedeEvidence(deps, actorOf(res), id, input));
  });

  return router;
}
