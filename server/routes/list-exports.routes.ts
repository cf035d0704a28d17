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
import { TECHNIQUE_STATE_LABELS, VERDICT_LABELS, findingClassLabel, rootCauseMethodLabel, ruleLabel, stateLabel } from '../../shared/labels';
import { formatDate, formatDateTime } from '../../shared/format/dates';
import { listUsers } from '../services/user-admin.service';
import { listTechniques } from '../services/technique.service';
import { listAudits } from '../services/audits.service';
import { listFindings } from '../services/findings.service';
import { listActions } from '../services/actions.service';
import type { AppDeps } from '../app-deps';

const USER_COLUMNS = (tz: string): CsvColumn<UserView>[] => [
  { header: 'Name', value: (u) => u.displayName },
  { header: 'E-mail', value: (u) => u.email },
  { header: 'Roles', value: (u) => u.roles.map((role) => ROLE_LABELS[role as Role] ?? role).join('; ') },
  { header: 'Area', value: (u) => u.areaName },
  { header: 'Active', value: (u) => u.active },
];
/** Administrators also see whether sign-in is locked, and until when. */
const USER_ADMIN_COLUMNS = (tz: string): CsvColumn<UserView>[] => [...USER_COLUMNS(tz), { header: 'Sign-in locked until', value: (u) => (u.lockedUntil ? formatDateTime(u.lockedUntil, tz) : '') }];

const TECHNIQUE_COLUMNS = (tz: string): CsvColumn<TechniqueListItem>[] => [
  { header: 'Code', value: (t) => t.code },
  { header: 'Title', value: (t) => t.title },
  { header: 'Area', value: (t) => t.areaName },
  { header: 'Latest revision', value: (t) => t.revision },
  { header: 'State', value: (t) => TECHNIQUE_STATE_LABELS[t.state] ?? t.state },
  { header: 'Approved revision in force', value: (t) => t.approvedRevision ?? (t.state === 'approved' ? t.revision : null) },
  { header: 'Checklist verdict', value: (t) => (t.verdict ? VERDICT_LABELS[t.verdict] : null) },
  { header: 'Failed rules', value: (t) => t.failedRules.map(ruleLabel).join('; ') },
  { header: 'Updated', value: (t) => formatDateTime(t.updatedAt, tz) },
];

const AUDIT_COLUMNS = (tz: string): CsvColumn<AuditView>[] => [
  { header: 'Audit', value: (a) => a.id },
  { header: 'Title', value: (a) => a.title },
  { header: 'Area', value: (a) => a.areaName },
  { header: 'Lead auditor', value: (a) => a.leadAuditor?.displayName },
  { header: 'Planned start', value: (a) => formatDate(a.plannedStart) },
  { header: 'Planned end', value: (a) => formatDate(a.plannedEnd) },
  { header: 'State', value: (a) => stateLabel(a.state) },
  { header: 'Techniques', value: (a) => a.scope.map((item) => `${item.code} rev ${item.revision}`).join('; ') },
  { header: 'Open findings', value: (a) => a.openFindingCount },
  { header: 'Issued', value: (a) => (a.issuedAt ? formatDateTime(a.issuedAt, tz) : null) },
  { header: 'Closed', value: (a) => (a.closedAt ? formatDateTime(a.closedAt, tz) : null) },
];

const FINDING_COLUMNS = (tz: string): CsvColumn<FindingView>[] => [
  { header: 'Number', value: (f) => f.number },
  { header: 'Title', value: (f) => f.title },
  { header: 'Class', value: (f) => findingClassLabel(f.class, '') },
  { header: 'State', value: (f) => stateLabel(f.state) },
  { header: 'Area', value: (f) => f.areaName },
  { header: 'Audit', value: (f) => f.auditTitle },
  { header: 'Technique', value: (f) => f.techniqueCode },
  { header: 'Rule', value: (f) => ruleLabel(f.rule) },
  { header: 'Raised by', value: (f) => f.author?.displayName },
  { header: 'Raised', value: (f) => formatDateTime(f.createdAt, tz) },
  { header: 'Due', value: (f) => (f.dueDate ? formatDate(f.dueDate) : null) },
  { header: 'Overdue', value: (f) => f.overdue },
  { header: 'Action', value: (f) => f.action?.number },
  { header: 'Action owner', value: (f) => f.action?.owner?.displayName },
  { header: 'Closed', value: (f) => (f.closedAt ? formatDateTime(f.closedAt, tz) : null) },
];

const ACTION_COLUMNS = (tz: string): CsvColumn<ActionView>[] => [
  { header: 'Number', value: (a) => a.number },
  { header: 'Finding', value: (a) => a.finding?.number },
  { header: 'Finding title', value: (a) => a.finding?.title },
  { header: 'Owner', value: (a) => a.owner?.displayName },
  { header: 'State', value: (a) => stateLabel(a.state) },
  { header: 'Due', value: (a) => (a.dueDate ? formatDate(a.dueDate) : null) },
  { header: 'Overdue', value: (a) => a.overdue },
  { header: 'Root-cause method', value: (a) => (a.method ? rootCauseMethodLabel(a.method) : null) },
  { header: 'Evidence files', value: (a) => a.evidenceCount },
  { header: 'Verified', value: (a) => (a.verifiedAt ? formatDateTime(a.verifiedAt, tz) : null) },
];

export function listExportRoutes(deps: AppDeps): Router {
  const router = Router();
  const now = () => deps.clock.now();
  const tz = deps.config.organisation.timeZone;

  router.get('/users.csv', requires.can('read', 'User'), async (req, res) => {
    const administrator = res.locals.ability!.can('unlock', 'User');
    const rows = await collectAllPages((query) => listUsers(query, { administrator, now: now() }), parseQuery(UserListQuerySchema, req));
    sendCsv(res, 'people', administrator ? USER_ADMIN_COLUMNS(tz) : USER_COLUMNS(tz), rows, now());
  });

  router.get('/techniques.csv', requires.can('read', 'Technique'), async (req, res) => {
    const rows = await collectAllPages(listTechniques, parseQuery(TechniqueListQuerySchema, req));
    sendCsv(res, 'techniques', TECHNIQUE_COLUMNS(tz), rows, now());
  });

  router.get('/audits.csv', requires.can('read', 'Audit'), async (req, res) => {
    const rows = await collectAllPages((q) => listAudits(res.locals.ability!, q), parseQuery(AuditListQuerySchema, req));
    sendCsv(res, 'audits', AUDIT_COLUMNS(tz), rows, now());
  });

  router.get('/findings.csv', requires.can('read', 'Finding'), async (req, res) => {
    const rows = await collectAllPages((q) => listFindings(deps, res.locals.ability!, q), parseQuery(FindingListQuerySchema, req));
    sendCsv(res, 'findings', FINDING_COLUMNS(tz), rows, now());
  });

  router.get('/actions.csv', requires.can('read', 'CorrectiveAction'), async (req, res) => {
    const rows = await collectAllPages((q) => listActions(deps, res.locals.ability!, q), parseQuery(ActionListQuerySchema, req));
    sendCsv(res, 'corrective-actions', ACTION_COLUMNS(tz), rows, now());
  });

  return router;
}
