// Rule 8 (equipment): every instrument, probe and reference standard the technique
// calls for must be within calibration. Runs only on facts from the registers.
import { EQUIPMENT_KINDS, isoDay, utcDay } from '../registers';
import type { Rule } from '../types';

const BASIS = 'equipment used for inspection must be within its calibration period (quality-system control of monitoring and measuring equipment)';

const KIND_WORDS = { instrument: 'instrument', probe: 'probe', 'reference-standard': 'reference standard' } as const;

export const equipment: Rule = ({ registers, now }, results) => {
  if (!registers) return;
  const today = utcDay(now);
  const items = registers.equipment ?? [];
  for (const kind of EQUIPMENT_KINDS) {
    if (!items.some((item) => item.kind === kind)) {
      results.push({
        rule: 'equipment',
        status: 'warn',
        message: `No ${KIND_WORDS[kind]} is on record for this technique, so its calibration cannot be checked.`,
        values: { kind },
        basis: BASIS,
      });
    }
  }
  for (const item of items) {
    const name = `${KIND_WORDS[item.kind]} "${item.description}"${item.serialNumber ? ` (s/n ${item.serialNumber})` : ''}`;
    const due = item.calibrationDueOn;
    const values = { kind: item.kind, description: item.description, calibrationDueOn: due ? isoDay(due) : null };
    if (!due) {
      results.push({ rule: 'equipment', status: 'fail', message: `The ${name} has no calibration record: calibrate it before use.`, values, basis: BASIS });
    } else if (utcDay(due) < today) {
      results.push({
        rule: 'equipment',
        status: 'fail',
        message: `The ${name} was due for calibration on ${isoDay(due)} and is overdue: take it out of use until it is calibrated, and review the inspections made with it since that date.`,
        values,
        basis: BASIS,
      });
    } else {
      results.push({ rule: 'equipment', status: 'pass', message: `The ${name} is calibrated until ${isoDay(due)}.`, values, basis: BASIS });
    }
  }
};
