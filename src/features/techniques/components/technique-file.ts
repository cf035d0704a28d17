// A technique as a JSON file: the same shape the checklist engine and the
// command line read, so a file exported here checks the same anywhere.
import { parseTechnique, type Technique, type TechniqueIssue } from '../../../../shared/domain/checklist';

export function downloadTechniqueFile(technique: unknown, fileName: string) {
  const blob = new Blob([`${JSON.stringify(technique, null, 2)}\n`], { type: 'application/json' });
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = fileName;
  document.body.append(link);
  link.click();
  link.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

export function techniqueFileName(code: string, revision: string) {
  const safe = (text: string) => text.replace(/[^A-Za-z0-9._-]+/g, '-').replace(/^-+|-+$/g, '') || 'technique';
  return `${safe(code)}-rev-${safe(revision)}.json`;
}

export type ImportResult = { ok: true; technique: Technique } | { ok: false; reason: string; issues: TechniqueIssue[] };

const MAX_BYTES = 1_000_000;

export async function readTechniqueFile(file: File): Promise<ImportResult> {
  if (file.size > MAX_BYTES) return { ok: false, reason: `${file.name} is larger than 1 MB: not a technique file`, issues: [] };
  let data: unknown;
  try {
    data = JSON.parse(await file.text());
  } catch (error) {
    return { ok: false, reason: `${file.name} is not valid JSON (${error instanceof Error ? error.message : 'unreadable'})`, issues: [] };
  }
  const parsed = parseTechnique(data);
  if (!parsed.success) return { ok: false, reason: `${file.name} is not a valid technique: nothing was changed in the form`, issues: parsed.issues };
  return { ok: true, technique: parsed.data };
}
