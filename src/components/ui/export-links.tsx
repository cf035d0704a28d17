// Download links for exports: a list as CSV (every page, with the filters now in
// the address bar) and a record as PDF or JSON. Shown only to roles the server
// lets export; the server checks again.
import { withQuery } from '../../lib/api-client';
import { useAbility } from '../../lib/ability';
import type { SubjectName } from '../../../shared/abilities';

const linkClass =
  'inline-flex items-center gap-2 rounded-md border border-ink/20 bg-white px-3 py-1.5 text-sm font-bold text-ink hover:border-ink/50';

/** `path` like "/findings.csv"; `query` is the list's query (page and pageSize are dropped: the export holds every page). */
export function CsvExportLink({ path, query, label = 'Export CSV' }: { path: string; query: Record<string, string | number>; label?: string }) {
  const { page: _page, pageSize: _pageSize, ...filters } = query;
  return (
    <a href={`/api${withQuery(path, filters)}`} download className={linkClass}>
      {label}
    </a>
  );
}

const RECORDS = {
  audit: { subject: 'Audit', base: 'audits', pdf: 'report.pdf', pdfLabel: 'Audit report (PDF)' },
  finding: { subject: 'Finding', base: 'findings', pdf: 'record.pdf', pdfLabel: 'Finding record (PDF)' },
  action: { subject: 'CorrectiveAction', base: 'actions', pdf: null, pdfLabel: null },
  certification: { subject: 'Certification', base: 'certifications', pdf: null, pdfLabel: null },
  equipment: { subject: 'Equipment', base: 'equipment', pdf: null, pdfLabel: null },
  technique: { subject: 'Technique', base: 'techniques', pdf: null, pdfLabel: null },
} as const satisfies Record<string, { subject: SubjectName; base: string; pdf: string | null; pdfLabel: string | null }>;

/** PDF (audits and findings) and JSON (every record, trail included) downloads of one record. */
export function RecordExportLinks({ kind, id }: { kind: keyof typeof RECORDS; id: number }) {
  const ability = useAbility();
  const record = RECORDS[kind];
  if (!ability.can('export', record.subject)) return null;
  return (
    <div className="flex flex-wrap gap-2" role="group" aria-label="Export this record">
      {record.pdf && (
        <a href={`/api/${record.base}/${id}/${record.pdf}`} download className={linkClass}>
          {record.pdfLabel}
        </a>
      )}
      <a href={`/api/${record.base}/${id}/export.json`} download className={linkClass}>
        Record with trail (JSON)
      </a>
    </div>
  );
}
