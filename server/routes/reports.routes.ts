// PDF reports and JSON exports of single records. Each route checks the role
// rule for exporting the record type, then the record-level read through the
// record's own service (which also decides what evidence the exporter sees).
import { Router, type Response } from 'express';
import { requires } from '../middlewares/authorize';
import { parseParams } from '../lib/validate';
import { IdParamSchema } from '../../shared/schemas/common';
import type { AppDeps } from '../app-deps';
import {
  exportAction,
  exportAudit,
  exportCertification,
  exportEquipment,
  exportFinding,
  exportTechnique,
  type ExportEnvelope,
  type Exporter,
} from '../services/record-export.service';
import { renderAuditReport } from '../reports/audit-report.pdf';
import { renderFindingRecord } from '../reports/finding-record.pdf';
import { readTrailHead } from '../services/trail.service';
import { loadOrganisation } from '../services/organisation.service';
import { loadIssuedFindings } from '../services/audit-issue-snapshot';
import { presentTrail } from '../services/trail-read.service';

const exporterOf = (res: Response): Exporter => ({ user: res.locals.user!, ability: res.locals.ability! });

function sendAttachment(res: Response, body: Buffer | string, type: string, fileName: string) {
  res.setHeader('Content-Type', type);
  res.setHeader('Content-Disposition', `attachment; filename="${fileName}"`);
  res.setHeader('Cache-Control', 'no-store');
  res.send(body);
}

function sendJson(res: Response, fileName: string, exported: ExportEnvelope<unknown>) {
  sendAttachment(res, `${JSON.stringify(exported, null, 2)}\n`, 'application/json; charset=utf-8', fileName);
}

const safe = (text: string) => text.replace(/[^A-Za-z0-9._-]+/g, '-');

export function reportRoutes(deps: AppDeps): Router {
  const router = Router();

  router.get('/audits/:id/report.pdf', requires.can('export', 'Audit'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const exported = await exportAudit(deps, exporterOf(res), id);
    const [organisation, issuedFindings, trailHead] = await Promise.all([loadOrganisation(deps), loadIssuedFindings(deps.sequelize, id), readTrailHead(deps.sequelize)]);
    sendAttachment(res, await renderAuditReport(exported, deps.clock.now(), { organisation, issuedFindings, trailHead }), 'application/pdf', `audit-${id}-report.pdf`);
  });

  router.get('/findings/:id/record.pdf', requires.can('export', 'Finding'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const exported = await exportFinding(deps, exporterOf(res), id);
    const [organisation, trail, trailHead] = await Promise.all([loadOrganisation(deps), presentTrail(deps, exported.content.trail), readTrailHead(deps.sequelize)]);
    sendAttachment(res, await renderFindingRecord(exported, deps.clock.now(), { organisation, trail, trailHead }), 'application/pdf', `finding-${safe(exported.content.record.number)}.pdf`);
  });

  router.get('/audits/:id/export.json', requires.can('export', 'Audit'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    sendJson(res, `audit-${id}.json`, await exportAudit(deps, exporterOf(res), id));
  });

  router.get('/findings/:id/export.json', requires.can('export', 'Finding'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const exported = await exportFinding(deps, exporterOf(res), id);
    sendJson(res, `finding-${safe(exported.content.record.number)}.json`, exported);
  });

  router.get('/actions/:id/export.json', requires.can('export', 'CorrectiveAction'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const exported = await exportAction(deps, exporterOf(res), id);
    sendJson(res, `action-${safe(exported.content.record.number)}.json`, exported);
  });

  router.get('/certifications/:id/export.json', requires.can('export', 'Certification'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    sendJson(res, `certification-${id}.json`, await exportCertification(deps, exporterOf(res), id));
  });

  router.get('/equipment/:id/export.json', requires.can('export', 'Equipment'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    sendJson(res, `equipment-${id}.json`, await exportEquipment(deps, exporterOf(res), id));
  });

  router.get('/techniques/:id/export.json', requires.can('export', 'Technique'), async (req, res) => {
    const { id } = parseParams(IdParamSchema, req);
    const exported = await exportTechnique(deps, exporterOf(res), id);
    sendJson(res, `technique-${safe(exported.content.record.code)}.json`, exported);
  });

  return router;
}
