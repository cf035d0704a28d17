// Reminder candidates for certificates and near-vision exams about to lapse.
// The mail scheduler turns each candidate into one outbox message; dedupeKey is
// stable per record, date and threshold, so a daily run sends each reminder once
// (60 and 30 days before expiry, on expiry; 30 days before a vision exam lapses, on lapse).
import { Op } from 'sequelize';
import type { AppDeps } from '../app-deps';
import { Certification, RoleAssignment, User } from '../models';
import { loadRegisterPolicy } from './register-policy';
import { CERTIFICATE_WARNING_DAYS, VISION_WARNING_DAYS, certificateFlag, visionFlag } from '../../shared/registers/flags';
import { isoDay } from '../../shared/domain/checklist/registers';

export interface CertificationReminder {
  kind: 'certificate-expiry' | 'vision-exam';
  certificationId: number;
  /** The certified person; quality managers are copied (they plan re-certification). */
  userId: number;
  personName: string;
  recipientUserIds: number[];
  /** 60, 30 or 0 (lapsed) days before the date. */
  threshold: number;
  dueOn: string;
  daysLeft: number;
  subject: string;
  text: string;
  dedupeKey: string;
}

const thresholdFor = (daysLeft: number, thresholds: readonly number[]) => {
  if (daysLeft < 0) return 0;
  const passed = thresholds.filter((t) => daysLeft <= t);
  return passed.length ? Math.min(...passed) : null;
};

export async function certificationReminderCandidates(deps: AppDeps, now: Date = deps.clock.now()): Promise<CertificationReminder[]> {
  const policy = await loadRegisterPolicy(deps.sequelize);
  const horizon = isoDay(new Date(now.getTime() + Math.max(...CERTIFICATE_WARNING_DAYS, VISION_WARNING_DAYS) * 86_400_000));
  const rows = await Certification.findAll({
    where: {
      active: true,
      [Op.or]: [
        { expiresOn: { [Op.lte]: horizon } },
        { nearVisionExamOn: null },
        deps.sequelize.where(deps.sequelize.literal(`DATE_ADD(near_vision_exam_on, INTERVAL ${Number(policy.nearVisionExamMonths)} MONTH)`), Op.lte, horizon),
      ],
    },
    include: [{ model: User, as: 'person', attributes: ['id', 'displayName', 'active'], where: { active: true } }],
    order: [['id', 'ASC']],
  });
  const managers = await RoleAssignment.findAll({
    where: { role: 'quality_manager' },
    include: [{ model: User, as: 'user', attributes: ['id'], where: { active: true } }],
  });
  const managerIds = managers.map((assignment) => assignment.userId);
  const reminders: CertificationReminder[] = [];
  for (const row of rows) {
    const name = row.person?.displayName ?? `person ${row.userId}`;
    const recipients = [...new Set([row.userId, ...managerIds])];
    const label = `${row.method} Level ${row.level} certificate ${row.certificateNumber}`;
    const certificate = certificateFlag(row.expiresOn, now);
    const expiryThreshold = thresholdFor(certificate.daysLeft, CERTIFICATE_WARNING_DAYS);
    if (expiryThreshold !== null) {
      const lapsed = expiryThreshold === 0;
      reminders.push({
        kind: 'certificate-expiry',
        certificationId: row.id,
        userId: row.userId,
        personName: name,
        recipientUserIds: recipients,
        threshold: expiryThreshold,
        dueOn: row.expiresOn,
        daysLeft: certificate.daysLeft,
        subject: lapsed ? `${name}: ${label} has expired` : `${name}: ${label} expires on ${row.expiresOn}`,
        text: lapsed
          ? `${label} of ${name} expired on ${row.expiresOn}. Until it is renewed, ${name} must not perform or approve inspections under it.`
          : `${label} of ${name} expires on ${row.expiresOn}, in ${certificate.daysLeft} days. Plan the renewal or re-certification now.`,
        dedupeKey: `certification:${row.id}:expiry:${row.expiresOn}:${expiryThreshold}`,
      });
    }
  }
  reminders.push(...(await visionReminders(rows, managerIds, now, policy.nearVisionExamMonths)));
  return reminders;
}

/**
 * A near-vision exam belongs to the person, not to a certificate: someone holding
 * two certificates gets one reminder, judged on their latest exam on any of them.
 */
async function visionReminders(
  candidates: Certification[],
  managerIds: number[],
  now: Date,
  nearVisionExamMonths: number,
): Promise<CertificationReminder[]> {
  const userIds = [...new Set(candidates.map((row) => row.userId))];
  if (!userIds.length) return [];
  const held = await Certification.findAll({
    where: { active: true, userId: { [Op.in]: userIds } },
    attributes: ['id', 'userId', 'method', 'level', 'certificateNumber', 'nearVisionExamOn'],
    order: [['id', 'ASC']],
  });
  const reminders: CertificationReminder[] = [];
  for (const userId of userIds) {
    const certificates = held.filter((row) => row.userId === userId);
    if (!certificates.length) continue;
    const examDates = certificates.map((row) => row.nearVisionExamOn).filter((day): day is string => day !== null);
    const latestExamOn = examDates.length ? examDates.reduce((a, b) => (a > b ? a : b)) : null;
    const vision = visionFlag(latestExamOn, now, nearVisionExamMonths);
    if (vision.status !== 'overdue' && vision.status !== 'due-soon' && vision.status !== 'missing') continue;
    const name = candidates.find((row) => row.userId === userId)?.person?.displayName ?? `person ${userId}`;
    const labels = certificates.map((row) => `${row.method} Level ${row.level} certificate ${row.certificateNumber}`).join(', ');
    const lapsed = vision.status !== 'due-soon';
    reminders.push({
      kind: 'vision-exam',
      certificationId: certificates[0].id,
      userId,
      personName: name,
      recipientUserIds: [...new Set([userId, ...managerIds])],
      threshold: lapsed ? 0 : VISION_WARNING_DAYS,
      dueOn: vision.dueOn ?? isoDay(now),
      daysLeft: vision.daysLeft ?? 0,
      subject: lapsed ? `${name}: near-vision exam overdue` : `${name}: near-vision exam due by ${vision.dueOn}`,
      text: vision.status === 'missing'
        ? `No near-vision exam is on record for ${name} (${labels}). A person performing ET needs one within the last ${nearVisionExamMonths} months.`
        : lapsed
          ? `The last near-vision exam of ${name} (${latestExamOn}) is more than ${nearVisionExamMonths} months old; it covers ${labels}. Until a new exam is recorded, ${name} must not perform ET.`
          : `The near-vision exam of ${name} (${latestExamOn}) counts until ${vision.dueOn}, ${vision.daysLeft} days from now; it covers ${labels}. Book the next exam.`,
      dedupeKey: `person:${userId}:vision:${latestExamOn ?? 'none'}:${lapsed ? 0 : VISION_WARNING_DAYS}`,
    });
  }
  return reminders;
}
