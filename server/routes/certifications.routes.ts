import { Router } from 'express';
import { requires } from '../middlewares/authorize';
import { parseBody, parseParams, parseQuery } from '../lib/validate';
import { IdParamSchema } from '../../shared/schemas/common';
import {
  CertificationCreateSchema,
  CertificationListQuerySchema,
  CertificationUpdateSchema,
  type CertificationView,
} from '../../shared/schemas/certification';
import { CERTIFICATE_STATUS_LABELS, VISION_STATUS_LABELS } from '../../shared/registers/flags';
import { createCertification, getCertification, listCertifications, updateCertification } from '../services/certification.service';
import { collectAllPages, sendCsv, type CsvColumn } from '../lib/csv';
import type { AppDeps } from '../app-deps';

export const CERTIFICATION_CSV_COLUMNS: CsvColumn<CertificationView>[] = [
  { header: 'Person', value: (c) => c.personName },
  { header: 'E-mail', value: (c) => c.personEmail },
  { header: 'Method', value: (c) => c.method },
  { header: 'Level', value: (c) => c.level },
  { header: 'Scheme', value: (c) => c.scheme },
  { header: 'Certificate number', value: (c) => c.certificateNumber },
  { header: 'Issued', value: (c) => c.issuedOn },
  { header: 'Expires', value: (c) => c.expiresOn },
  { header: 'Certificate status', value: (c) => CERTIFICATE_STATUS_LABELS[c.certificate.status] },
  { header: 'Days to expiry', value: (c) => c.certificate.daysLeft },
  { header: 'Last near-vision exam', value: (c) => c.nearVisionExamOn },
  { header: 'Near-vision exam due', value: (c) => c.vision.dueOn },
  { header: 'Near-vision status', value: (c) => VISION_STATUS_LABELS[c.vision.status] },
  { header: 'Colour-vision check', value: (c) => c.colourVisionCheckedOn },
  { header: 'Sectors', value: (c) => c.sectors.join('; ') },
];

export function certificationRoutes(deps: AppDeps): Router {
  const router = Router();

  router.get('/certifications', requires.can('read', 'Certification'), async (req, res) => {
    res.json(await listCertifications(deps, parseQuery(CertificationListQuerySchema, req)));
  });

  router.get('/certifications.csv', requires.can('read', 'Certification'), async (req, res) => {
    const query = parseQuery(CertificationListQuerySchema, req);
    const rows = await collectAllPages((q) => listCertifications(deps, q), query);
    sendCsv(res, 'certifications', CERTIFICATION_CSV_COLUMNS, rows, deps.clock.now());
  });

  router.get('/certifications/:id', requires.can('read', 'Certification'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    res.json(await getCertification(deps, id));
  });

  router.post('/certifications', requires.can('create', 'Certification'), async (req, res) => {
    const input = parseBody(CertificationCreateSchema, req);
    res.status(201).json(await createCertification(deps, res.locals.user!.id, input));
  });

  router.patch('/certifications/:id', requires.can('update', 'Certification'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const input = parseBody(CertificationUpdateSchema, req);
    res.json(await updateCertification(deps, res.locals.user!.id, id, input));
  });

  return router;
}
