// Who may read a record's timeline: the Trail rules of shared/abilities.ts
// (people's timelines: the person and administrators), and for an evidence
// file the right to open that file, checked on the loaded file.
import { subject } from '@casl/ability';
import type { Sequelize } from 'sequelize';
import type { AppAbility } from '../../shared/abilities';
import { EvidenceFile } from '../models';
import { AppError } from '../lib/app-error';
import { evidenceSubjectFields, loadEvidenceOwner } from './evidence-owners';

const refused = (message: string) => new AppError(message, { status: 403, code: 'forbidden' });

export async function assertMayReadTrail(sequelize: Sequelize, ability: AppAbility, recordType: string, recordId: string): Promise<void> {
  if (!ability.can('read', subject('Trail', { recordType, recordId }))) {
    throw refused('A person’s sign-in history is read by that person and by administrators only');
  }
  if (recordType !== 'evidence') return;
  const file = await EvidenceFile.findByPk(Number(recordId), { attributes: ['id', 'recordType', 'recordId', 'uploadedById'] });
  if (!file) return;
  const owner = await loadEvidenceOwner(sequelize, file.recordType, file.recordId);
  if (!ability.can('read', subject('Evidence', evidenceSubjectFields(owner, file.uploadedById)))) {
    throw refused('You may not open this file, so its timeline is not shown either');
  }
}
