// Certificates and near-vision exams about to lapse (60 and 30 days, and on
// lapse): the registers' candidates, turned into reminders for the person and
// the quality managers.
import { certificationReminderCandidates } from '../services/certification-reminders';
import type { ReminderSource } from './reminder-sources';

export const certificationReminderSource: ReminderSource = {
  name: 'certifications',
  async collect({ deps, now }) {
    const candidates = await certificationReminderCandidates(deps, now);
    return candidates.map((candidate) => ({
      kind: candidate.kind,
      recordType: 'certification',
      recordId: candidate.certificationId,
      to: candidate.recipientUserIds,
      subject: candidate.subject,
      paragraphs: [candidate.text],
      path: '/registers',
      linkLabel: 'Open the personnel register',
      dedupeKey: candidate.dedupeKey,
    }));
  },
};
