// Where an audit's techniques come from. A technique of the register (by id)
// is read from its approved revision (else its latest one) in the register's
// tables; a technique not (yet) in the register travels with the audit as the
// JSON the checklist engine reads. Either way the audit scope keeps the code,
// title, revision and definition evaluated, so a checklist run is reproducible.
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { parseTechnique } from '../../shared/domain/checklist';
import type { Technique } from '../../shared/schemas/technique';
import type { AuditScopeTechnique } from '../models';
import { AppError } from '../lib/app-error';

function invalidScope(index: number, message: string, details?: unknown): AppError {
  return new AppError(`Technique ${index + 1} of the scope: ${message}`, {
    status: 400,
    code: 'invalid_input',
    details: details ?? [{ path: `techniques.${index}`, message }],
  });
}

export function parseDefinition(definition: unknown, index: number): Technique {
  const parsed = parseTechnique(definition);
  if (!parsed.success) {
    throw invalidScope(
      index,
      'the technique is not valid',
      parsed.issues.map((issue) => ({ path: `techniques.${index}.technique.${issue.path}`, message: issue.message })),
    );
  }
  return parsed.data;
}

interface RegisterRow {
  id: number;
  code: string;
  title: string;
  revision: string;
  state: string;
  content: unknown;
}

/** Reads a technique of the register, or null when there is no such technique (or no register yet). */
export async function loadRegisterTechnique(
  sequelize: Sequelize,
  techniqueId: number,
  transaction?: Transaction,
): Promise<{ code: string; title: string; revision: string; state: string; content: unknown } | null> {
  try {
    const [row] = await sequelize.query<RegisterRow>(
      `SELECT t.id, t.code, t.title, r.revision, r.state, r.content
         FROM techniques t JOIN technique_revisions r ON r.technique_id = t.id
        WHERE t.id = ?
        ORDER BY (r.state = 'approved') DESC, r.seq DESC LIMIT 1`,
      { replacements: [techniqueId], type: QueryTypes.SELECT, transaction },
    );
    if (!row) return null;
    const content = typeof row.content === 'string' ? JSON.parse(row.content) : row.content;
    return { code: row.code, title: row.title, revision: row.revision, state: row.state, content };
  } catch (error) {
    if ((error as { original?: { code?: string } }).original?.code === 'ER_NO_SUCH_TABLE') return null;
    throw error;
  }
}

/** Resolves the scope of a new audit into what the audit keeps. */
export async function resolveScope(
  sequelize: Sequelize,
  items: Array<{ techniqueId?: number; revision?: string; technique?: Record<string, unknown> }>,
): Promise<AuditScopeTechnique[]> {
  const scope: AuditScopeTechnique[] = [];
  for (const [index, item] of items.entries()) {
    if (item.techniqueId) {
      const found = await loadRegisterTechnique(sequelize, item.techniqueId);
      if (!found) throw invalidScope(index, `there is no technique ${item.techniqueId} in the register`);
      // An audit covers the revision in force: a technique with only a draft has none yet.
      if (found.state !== 'approved') {
        throw invalidScope(index, `${found.code} has no approved revision in force (rev ${found.revision} is a draft)`, [
          { path: `techniques.${index}.techniqueId`, message: `${found.code} has no approved revision in force (rev ${found.revision} is a draft)` },
        ]);
      }
      // The revision the planner saw must still be the one in force.
      if (item.revision !== undefined && item.revision !== found.revision) {
        const message = `${found.code} rev ${item.revision} is not the revision in force (rev ${found.revision} is); plan the audit again`;
        throw invalidScope(index, message, [{ path: `techniques.${index}.revision`, message }]);
      }
      const content = found.content && typeof found.content === 'object' ? (found.content as Record<string, unknown>) : {};
      const definition = parseTechnique({ ...content, code: found.code, title: found.title, revision: found.revision });
      scope.push({
        techniqueId: item.techniqueId,
        code: found.code,
        title: found.title,
        revision: found.revision,
        definition: definition.success ? definition.data : null,
      });
    } else {
      const definition = parseDefinition(item.technique, index);
      scope.push({ techniqueId: null, code: definition.code, title: definition.title, revision: definition.revision, definition });
    }
  }
  const codes = scope.map((item) => item.code);
  const duplicate = codes.find((code, index) => codes.indexOf(code) !== index);
  if (duplicate) throw invalidScope(codes.lastIndexOf(duplicate), `${duplicate} is in the scope twice`);
  return scope;
}
