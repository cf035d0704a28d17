// Reminders about workflow records: corrective actions coming due, overdue
// (daily to the owner) and escalated to the quality managers; findings
// waiting for the accountable manager's signature; audits coming up (to the
// lead auditor and the audited area's lead).
import { QueryTypes } from 'sequelize';
import { usersWithRole } from '../mail/record-facts';
import { addDays, daysBetween, type Reminder, type ReminderSource } from './reminder-sources';

const OPEN_ACTION_STATES = ['assigned', 'investigating', 'plan_review', 'in_progress'];
const day = (value: unknown) => (value instanceof Date ? value.toISOString().slice(0, 10) : String(value));
const plural = (count: number, word: string) => `${count} ${word}${count === 1 ? '' : 's'}`;

export const actionReminderSource: ReminderSource = {
  name: 'corrective-actions',
  async collect({ deps, transaction, today }) {
    const { dueSoonDays, escalateAfterDays } = deps.config.reminders;
    const rows = await deps.sequelize.query<Record<string, unknown>>(
      `SELECT a.id, a.number, a.owner_id, a.due_date, a.state, f.number AS finding_number, f.title AS finding_title, u.display_name AS owner_name
         FROM corrective_actions a JOIN findings f ON f.id = a.finding_id JOIN users u ON u.id = a.owner_id
        WHERE a.state IN (?) AND a.due_date <= ?`,
      { replacements: [OPEN_ACTION_STATES, addDays(today, dueSoonDays)], type: QueryTypes.SELECT, transaction },
    );
    const managers = rows.length ? await usersWithRole(deps.sequelize, 'quality_manager', transaction) : [];
    const reminders: Reminder[] = [];
    for (const row of rows) {
      const id = Number(row.id);
      const number = String(row.number);
      const dueDate = day(row.due_date);
      const daysLeft = daysBetween(today, dueDate);
      const base = { recordType: 'action', recordId: id, path: `/actions/${id}`, linkLabel: `Open corrective action ${number}` };
      const about = `corrective action ${number} for finding ${String(row.finding_number)}, “${String(row.finding_title)}”`;
      if (daysLeft >= 0) {
        reminders.push({
          ...base,
          kind: 'action-due-soon',
          to: [Number(row.owner_id)],
          subject: daysLeft === 0 ? `${number} is due today` : `${number} is due in ${plural(daysLeft, 'day')} (${dueDate})`,
          paragraphs: [
            `Your ${about} is due on ${dueDate}${daysLeft === 0 ? ', today' : `, in ${plural(daysLeft, 'day')}`}.`,
            'If you cannot finish in time, ask for an extension on the record before the due date, with your reason.',
          ],
          // Once per due date: an approved extension sets a new date and a new reminder.
          dedupeKey: `action:${id}:due-soon:${dueDate}`,
        });
        continue;
      }
      const daysOverdue = -daysLeft;
      reminders.push({
        ...base,
        kind: 'action-overdue',
        to: [Number(row.owner_id)],
        subject: `${number} is overdue by ${plural(daysOverdue, 'day')}`,
        paragraphs: [
          `Your ${about} was due on ${dueDate} and is ${plural(daysOverdue, 'day')} overdue. It is still ${String(row.state).replace(/_/g, ' ')}.`,
          'Finish it, or ask the quality manager for an extension with your reason.',
        ],
        dedupeKey: `action:${id}:overdue:${today}`,
      });
      if (daysOverdue >= escalateAfterDays) {
        reminders.push({
          ...base,
          kind: 'action-escalated',
          to: managers,
          subject: `Escalation: ${number} is ${plural(daysOverdue, 'day')} overdue`,
          paragraphs: [
            `${String(row.owner_name)}'s ${about} was due on ${dueDate} and is still ${String(row.state).replace(/_/g, ' ')}, ${plural(daysOverdue, 'day')} later.`,
            'Please follow it up with the owner: reassign it, agree an extension, or help remove what blocks it.',
          ],
          dedupeKey: `action:${id}:escalated:${dueDate}`,
        });
      }
    }
    return reminders;
  },
};

export const signoffReminderSource: ReminderSource = {
  name: 'findings-awaiting-signature',
  async collect({ deps, transaction, today }) {
    const rows = await deps.sequelize.query<Record<string, unknown>>(
      `SELECT id, number, title, updated_at FROM findings WHERE state = 'awaiting_signoff' AND updated_at < ?`,
      { replacements: [new Date(`${today}T00:00:00Z`)], type: QueryTypes.SELECT, transaction },
    );
    if (!rows.length) return [];
    const signers = await usersWithRole(deps.sequelize, 'accountable_manager', transaction);
    return rows.map((row) => {
      const id = Number(row.id);
      const since = day(row.updated_at instanceof Date ? row.updated_at : new Date(String(row.updated_at)));
      const waiting = daysBetween(since, today);
      return {
        kind: 'finding-signoff-reminder',
        recordType: 'finding',
        recordId: id,
        to: signers,
        subject: `Finding ${String(row.number)} still awaits your signature`,
        paragraphs: [
          `Finding ${String(row.number)}, “${String(row.title)}”, was confirmed effective on ${since} and has waited ${plural(waiting, 'day')} for your closing signature.`,
        ],
        path: `/findings/${id}`,
        linkLabel: `Open finding ${String(row.number)}`,
        dedupeKey: `finding:${id}:awaiting-signoff:${today}`,
      };
    });
  },
};

export const auditReminderSource: ReminderSource = {
  name: 'audits-coming-up',
  async collect({ deps, transaction, today }) {
    const rows = await deps.sequelize.query<Record<string, unknown>>(
      `SELECT au.id, au.title, au.lead_auditor_id, au.planned_start, au.planned_end, ar.name AS area_name, ar.lead_user_id
         FROM audits au JOIN areas ar ON ar.id = au.area_id
        WHERE au.state = 'planned' AND au.planned_start >= ? AND au.planned_start <= ?`,
      { replacements: [today, addDays(today, deps.config.reminders.auditNoticeDays)], type: QueryTypes.SELECT, transaction },
    );
    return rows.map((row) => {
      const id = Number(row.id);
      const start = day(row.planned_start);
      const daysLeft = daysBetween(today, start);
      return {
        kind: 'audit-coming-up',
        recordType: 'audit',
        recordId: id,
        to: [Number(row.lead_auditor_id), ...(row.lead_user_id == null ? [] : [Number(row.lead_user_id)])],
        subject: `Audit “${String(row.title)}” starts ${daysLeft === 0 ? 'today' : `in ${plural(daysLeft, 'day')}`} (${start})`,
        paragraphs: [
          `The audit “${String(row.title)}” of ${String(row.area_name)} is planned from ${start} to ${day(row.planned_end)}.`,
          'Lead auditor: confirm the scope and the checklist runs. Area lead: have the written techniques, certificates and calibration records at hand.',
        ],
        path: `/audits/${id}`,
        linkLabel: `Open the audit “${String(row.title)}”`,
        dedupeKey: `audit:${id}:coming-up:${start}`,
      };
    });
  },
};
