// CSV exports of the record lists kept by other parts of Whorl: each reuses the
// list's own query schema and service (same filters, sort and record-level rules)
// and writes every page through the shared CSV helper (server/lib/csv.ts).
import { Router } from 'express';
import { requires } from '../middlewares/authorize';
import { parseQuery } from '../lib/validate';
import { collectAllPages, sendCsv, type CsvColumn } from '../lib/csv';
import { UserListQuerySchema, type UserView } from '../../shared/schemas/user';
import { TechniqueListQuerySchema, type TechniqueListItem } from '../../shared/schemas/technique-register';
import { ActionListQuerySchema, AuditListQuerySchema, FindingListQuerySchema, type ActionView, type AuditView, type FindingView } from '../../shared/schemas/workflow';
import { ROLE_LABELS, type Role } from '../../shared/roles';
import { listUsers } from '../services/user-admin.service';
import { listTechniques } from '../services/technique.service';
import { listAudits } from '../services/audits.service';
import { listFindings } from '../services/findings.service';
import { listActions } from '../services/actions.service';
import type { AppDeps } from '../app-deps';

const USER_COLUMNS: CsvColumn<UserView>[] = [
  { header: 'Name', value: (u) => u.displayName },
  { header: 'E-mail', value: (u) => u.email },
  { header: 'Roles', value: (u) => u.roles.map((role) => ROLE_LABELS[role as Role] ?? role).join('; ') },
  { header: 'Area', value: (u) => u.areaName },
  { header: 'Active', value: (u) => u.active },
];
/** Administrators also see whether sign-in is locked, and until when. */
const USER_ADMIN_COLUMNS: CsvColumn<UserView>[] = [...USER_COLUMNS, { header: 'Sign-in locked until', value: (u) => u.lockedUntil ?? '' }];

const TECHNIQUE_COLUMNS: CsvColumn<TechniqueListItem>[] = [
  { header: 'Code', value: (t) => t.code },
  { header: 'Title', value: (t) => t.title },
  { header: 'Area', value: (t) => t.areaName },
  { header: 'Latest revision', value: (t) => t.revision },
  { header: 'State', value: (t) => t.state },
  { header: 'Approved revision in force', value: (t) => t.approvedRevision ?? (t.state === 'approved' ? t.revision : null) },
  { header: 'Checklist verdict', value: (t) => t.verdict },
  { header: 'Failed rules', value: (t) => t.failedRules.join('; ') },
  { header: 'Updated', value: (t) => t.updatedAt },
];

const AUDIT_COLUMNS: CsvColumn<AuditView>[] = [
  { header: 'Audit', value: (a) => a.id },
  { header: 'Title', value: (a) => a.title },
  { header: 'Area', value: (a) => a.areaName },
  { header: 'Lead auditor', value: (a) => a.leadAuditor?.displayName },
  { header: 'Planned start', value: (a) => a.plannedStart },
  { header: 'Planned end', value: (a) => a.plannedEnd },
  { header: 'State', value: (a) => a.state },
  { header: 'Techniques', value: (a) => a.scope.map((item) => `${item.code} rev ${item.revision}`).join('; ') },
  { header: 'Open findings', value: (a) => a.openFindingCount },
  { header: 'Issued', value: (a) => a.issuedAt },
  { header: 'Closed', value: (a) => a.closedAt },
];

const FINDING_COLUMNS: CsvColumn<FindingView>[] = [
  { header: 'Number', value: (f) => f.number },
  { header: 'Title', value: (f) => f.title },
  { header: 'Class', value: (f) => f.class },
  { header: 'State', value: (f) => f.state },
  { header: 'Area', value: (f) => f.areaName },
  { header: 'Audit', value: (f) => f.auditTitle },
  { header: 'Technique', value: (f) => f.techniqueCode },
  { header: 'Rule', value: (f) => f.rule },
  { header: 'Raised by', value: (f) => f.author?.displayName },
  { header: 'Raised', value: (f) => f.createdAt },
  { header: 'Due', value: (f) => f.dueDate },
  { header: 'Overdue', value: (f) => f.overdue },
  { header: 'Action', value: (f) => f.action?.number },
  { header: 'Action owner', value: (f) => f.action?.owner?.displayName },
  { header: 'Closed', value: (f) => f.closedAt },
];

const ACTION_COLUMNS: CsvColumn<ActionView>[] = [
  { header: 'Number', value: (a) => a.number },
  { header: 'Finding', value: (a) => a.finding?.number },
  { header: 'Finding title', value: (a) => a.finding?.title },
  { header: 'Owner', value: (a) => a.owner?.displayName },
  { header: 'State', value: (a) => a.state },
  { header: 'Due', value: (a) => a.dueDate },
  { header: 'Overdue', value: (a) => a.overdue },
  { header: 'Root-cause method', value: (a) => a.method },
  { header: 'Evidence files', value: (a) => a.evidenceCount },
  { header: 'Verified', value: (a) => a.verifiedAt },
];

export function listExportRoutes(deps: AppDeps): Router {
  const router = Router();
  const now = () => deps.clock.now();

  router.get('/users.csv', requires.can('read', 'User'), async (req, res) => {
    const administrator = res.locals.ability!.can('unlock', 'User');
    const rows = await collectAllPages((query) => listUsers(query, { administrator, now: now() }), parseQuery(UserListQuerySchema, req));
    sendCsv(res, 'people', administrator ? USER_ADMIN_COLUMNS : USER_COLUMNS, rows, now());
  });

  router.get('/techniques.csv', requires.can('read', 'Technique'), async (req, res) => {
    const rows = await collectAllPages(listTechniques, parseQuery(TechniqueListQuerySchema, req));
    sendCsv(res, 'techniques', TECHNIQUE_COLUMNS, rows, now());
  });

  router.get('/audits.csv', requires.can('read', 'Audit'), async (req, res) => {
    const rows = await collectAllPages((q) => listAudits(res.locals.ability!, q), parseQuery(AuditListQuerySchema, req));
    sendCsv(res, 'audits', AUDIT_COLUMNS, rows, now());
  });

  router.get('/findings.csv', requires.can('read', 'Finding'), async (req, res) => {
    const rows = await collectAllPages((q) => listFindings(deps, res.locals.ability!, q), parseQuery(FindingListQuerySchema, req));
    sendCsv(res, 'findings', FINDING_COLUMNS, rows, now());
  });

  router.get('/actions.csv', requires.can('read', 'CorrectiveAction'), async (req, res) => {
    const rows = await collectAllPages((q) => listActions(deps, res.locals.ability!, q), parseQuery(ActionListQuerySchema, req));
    sendCsv(res, 'corrective-actions', ACTION_COLUMNS, rows, now());
  });

  return router;
}
