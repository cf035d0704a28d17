// The dashboard's numbers, every one computed in SQL over the workflow tables.
// "Open" means neither closed nor withdrawn; an action counts as closed once
// verified (on time when verified on or before its due date, UTC days).
import { QueryTypes, type Sequelize } from 'sequelize';
import type { AppDeps } from '../app-deps';
import { AGE_BANDS, UNCLASSIFIED, type DashboardQuery, type DashboardView } from '../../shared/schemas/dashboard';
import { isoDay } from '../../shared/domain/checklist/registers';

interface Range {
  from: string;
  to: string;
  today: string;
  areaId: number | null;
}

/**
 * By default a year back and a year ahead: findings can only be raised up to
 * today, but corrective actions fall due in the future, and a range ending
 * today would leave "Open, not yet due" always empty.
 */
function defaultRange(query: DashboardQuery, now: Date): Range {
  const today = isoDay(now);
  const yearAgo = new Date(Date.UTC(now.getUTCFullYear() - 1, now.getUTCMonth(), 1));
  const endOfMonthYearAhead = new Date(Date.UTC(now.getUTCFullYear() + 1, now.getUTCMonth() + 1, 0));
  return { from: query.from ?? isoDay(yearAgo), to: query.to ?? isoDay(endOfMonthYearAhead), today, areaId: query.areaId ?? null };
}

const select = <T extends object>(sequelize: Sequelize, sql: string, replacements: Record<string, unknown>) =>
  sequelize.query<T>(sql, { type: QueryTypes.SELECT, replacements });

/** Findings raised within [from, to] (whole UTC days), optionally in one area. */
const FINDING_RANGE = `f.created_at >= :from AND f.created_at < DATE_ADD(:to, INTERVAL 1 DAY) AND (:areaId IS NULL OR f.area_id = :areaId)`;

export async function computeDashboard({ sequelize, clock }: AppDeps, query: DashboardQuery): Promise<DashboardView> {
  const range = defaultRange(query, clock.now());
  const params = { ...range };

  const [openByClassAge, actions, meanClose, failing, audited, byArea, totals] = await Promise.all([
    select<{ cls: string; band: number; n: number | string }>(
      sequelize,
      `SELECT COALESCE(f.class, '${UNCLASSIFIED}') AS cls,
              CASE WHEN DATEDIFF(:today, f.created_at) <= 30 THEN 0
                   WHEN DATEDIFF(:today, f.created_at) <= 60 THEN 1
                   WHEN DATEDIFF(:today, f.created_at) <= 90 THEN 2 ELSE 3 END AS band,
              COUNT(*) AS n
         FROM findings f
        WHERE f.state NOT IN ('closed', 'withdrawn') AND ${FINDING_RANGE}
        GROUP BY cls, band
        ORDER BY cls, band`,
      params,
    ),
    select<{ month: string; due: number | string; onTime: number | string; late: number | string; overdue: number | string; openNotDue: number | string }>(
      sequelize,
      `SELECT DATE_FORMAT(a.due_date, '%Y-%m') AS month,
              COUNT(*) AS due,
              SUM(a.state = 'verified' AND DATE(a.verified_at) <= a.due_date) AS onTime,
              SUM(a.state = 'verified' AND DATE(a.verified_at) > a.due_date) AS late,
              SUM(a.state <> 'verified' AND a.due_date < :today) AS overdue,
              SUM(a.state <> 'verified' AND a.due_date >= :today) AS openNotDue
         FROM corrective_actions a JOIN findings f ON f.id = a.finding_id
        WHERE a.due_date BETWEEN :from AND :to AND (:areaId IS NULL OR f.area_id = :areaId)
        GROUP BY month
        ORDER BY month`,
      params,
    ),
    select<{ cls: string; closed: number | string; meanDays: number | string }>(
      sequelize,
      `SELECT COALESCE(f.class, '${UNCLASSIFIED}') AS cls, COUNT(*) AS closed,
              AVG(TIMESTAMPDIFF(SECOND, f.created_at, f.closed_at)) / 86400 AS meanDays
         FROM findings f
        WHERE f.state = 'closed' AND f.closed_at >= :from AND f.closed_at < DATE_ADD(:to, INTERVAL 1 DAY)
          AND (:areaId IS NULL OR f.area_id = :areaId)
        GROUP BY cls
        ORDER BY cls`,
      params,
    ),
    select<{ rule: string; techniques: number | string; runs: number | string; failures: number | string }>(
      sequelize,
      `SELECT jt.rule AS rule, COUNT(DISTINCT r.technique_code) AS techniques, COUNT(DISTINCT r.id) AS runs, COUNT(*) AS failures
         FROM checklist_runs r
         JOIN audits au ON au.id = r.audit_id
         JOIN JSON_TABLE(r.output, '$.results[*]' COLUMNS (rule VARCHAR(64) PATH '$.rule', status VARCHAR(20) PATH '$.status')) AS jt
        WHERE jt.status = 'fail' AND r.run_at >= :from AND r.run_at < DATE_ADD(:to, INTERVAL 1 DAY)
          AND (:areaId IS NULL OR au.area_id = :areaId)
        GROUP BY jt.rule
        ORDER BY techniques DESC, failures DESC, rule`,
      params,
    ),
    select<{ n: number | string }>(
      sequelize,
      `SELECT COUNT(DISTINCT r.technique_code) AS n
         FROM checklist_runs r JOIN audits au ON au.id = r.audit_id
        WHERE r.run_at >= :from AND r.run_at < DATE_ADD(:to, INTERVAL 1 DAY) AND (:areaId IS NULL OR au.area_id = :areaId)`,
      params,
    ),
    select<{ areaId: number; areaName: string; open: number | string; closed: number | string; withdrawn: number | string }>(
      sequelize,
      `SELECT ar.id AS areaId, ar.name AS areaName,
              COALESCE(SUM(f.state NOT IN ('closed', 'withdrawn')), 0) AS open,
              COALESCE(SUM(f.state = 'closed'), 0) AS closed,
              COALESCE(SUM(f.state = 'withdrawn'), 0) AS withdrawn
         FROM areas ar
         LEFT JOIN findings f ON f.area_id = ar.id AND f.created_at >= :from AND f.created_at < DATE_ADD(:to, INTERVAL 1 DAY)
        WHERE (:areaId IS NULL OR ar.id = :areaId)
        GROUP BY ar.id, ar.name
        ORDER BY ar.name`,
      params,
    ),
    select<{ openFindings: number | string; closedFindings: number | string; overdueActions: number | string; checklistRuns: number | string }>(
      sequelize,
      `SELECT
         (SELECT COUNT(*) FROM findings f WHERE f.state NOT IN ('closed', 'withdrawn') AND ${FINDING_RANGE}) AS openFindings,
         (SELECT COUNT(*) FROM findings f WHERE f.state = 'closed' AND ${FINDING_RANGE}) AS closedFindings,
         (SELECT COUNT(*) FROM corrective_actions a JOIN findings f ON f.id = a.finding_id
           WHERE a.state <> 'verified' AND a.due_date < :today AND (:areaId IS NULL OR f.area_id = :areaId)) AS overdueActions,
         (SELECT COUNT(*) FROM checklist_runs r JOIN audits au ON au.id = r.audit_id
           WHERE r.run_at >= :from AND r.run_at < DATE_ADD(:to, INTERVAL 1 DAY) AND (:areaId IS NULL OR au.area_id = :areaId)) AS checklistRuns`,
      params,
    ),
  ]);

  const n = (value: number | string | null | undefined) => Number(value ?? 0);
  const t = totals[0];
  return {
    range: { from: range.from, to: range.to, areaId: range.areaId, today: range.today },
    totals: { openFindings: n(t?.openFindings), closedFindings: n(t?.closedFindings), overdueActions: n(t?.overdueActions), checklistRuns: n(t?.checklistRuns) },
    openFindingsByClassAge: openByClassAge.map((row) => ({ class: row.cls, band: AGE_BANDS[Number(row.band)], count: n(row.n) })),
    actionsByMonth: actions.map((row) => ({
      month: row.month,
      due: n(row.due),
      closedOnTime: n(row.onTime),
      closedLate: n(row.late),
      overdue: n(row.overdue),
      openNotDue: n(row.openNotDue),
    })),
    meanDaysToClose: meanClose.map((row) => ({ class: row.cls, closed: n(row.closed), meanDays: Math.round(n(row.meanDays) * 10) / 10 })),
    failingRules: failing.map((row) => ({ rule: row.rule, techniques: n(row.techniques), runs: n(row.runs), failures: n(row.failures) })),
    techniquesAudited: n(audited[0]?.n),
    findingsByArea: byArea.map((row) => ({ areaId: row.areaId, areaName: row.areaName, open: n(row.open), closed: n(row.closed), withdrawn: n(row.withdrawn) })),
  };
}
