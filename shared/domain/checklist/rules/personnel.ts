// Rule 8 (people): the technique approved by a Level 3 certified in ET; each person
// performing it certified in ET at Level 2 or 3, with a valid certificate and a
// recent near-vision exam. Runs only on facts the server supplies from the registers.
import { isoDay, utcDay, utcDayPlusMonths, type CertificationFact, type PersonFact } from '../registers';
import { list } from '../format';
import type { Rule, RuleResult } from '../types';

const APPROVER_BASIS = 'technique approval by a Level 3 certified in eddy current testing (personnel certification schemes such as ISO 9712 / EN 4179)';
const PERFORMER_BASIS =
  '[mem] ISO 9712 / EN 4179: ET Level 2 or 3, certificate validity up to policy certificateValidityYears (default 5); [pub] ISO 9712: near-vision exam within policy nearVisionExamMonths (default 12)';

function isEt(certification: CertificationFact): boolean {
  return certification.method.trim().toUpperCase() === 'ET';
}

interface CertificateCheck {
  valid: CertificationFact | undefined;
  problems: string[];
}

/** The best ET certificate at or above `minLevel` that is valid on `onDay`, or why none is. */
function checkCertificates(person: PersonFact, minLevel: number, onDay: number, validityYears: number): CertificateCheck {
  const et = person.certifications.filter(isEt);
  if (et.length === 0) return { valid: undefined, problems: ['holds no ET certificate'] };
  const atLevel = et.filter((c) => c.level >= minLevel);
  if (atLevel.length === 0) {
    return { valid: undefined, problems: [`is certified in ET at Level ${Math.max(...et.map((c) => c.level))} only; Level ${minLevel}${minLevel < 3 ? ' or 3' : ''} is required`] };
  }
  const problems: string[] = [];
  for (const certification of atLevel) {
    const label = `an ET Level ${certification.level} certificate${certification.certificateNumber ? ` (no. ${certification.certificateNumber})` : ''}`;
    if (utcDay(certification.expiresOn) < onDay) {
      problems.push(`holds ${label} that expired on ${isoDay(certification.expiresOn)}`);
      continue;
    }
    if (certification.issuedOn && utcDayPlusMonths(certification.issuedOn, validityYears * 12) < utcDay(certification.expiresOn)) {
      problems.push(`holds ${label} running from ${isoDay(certification.issuedOn)} to ${isoDay(certification.expiresOn)}, longer than the ${validityYears}-year maximum validity`);
      continue;
    }
    if (certification.issuedOn && utcDay(certification.issuedOn) > onDay) {
      problems.push(`holds ${label} not issued until ${isoDay(certification.issuedOn)}`);
      continue;
    }
    return { valid: certification, problems: [] };
  }
  return { valid: undefined, problems };
}

export const personnel: Rule = ({ registers, policy, now }, results) => {
  if (!registers) return;
  const today = utcDay(now);
  const validityYears = policy.certificateValidityYears;

  const approvalDay = registers.approvedOn ? utcDay(registers.approvedOn) : today;
  const approvalWhen = registers.approvedOn ? `on the approval date, ${isoDay(registers.approvedOn)}` : 'today';
  const approver = registers.approver;
  if (!approver) {
    results.push({
      rule: 'personnel',
      status: 'fail',
      message: 'The technique has no recorded approval: it must be approved by a Level 3 certified in ET before use.',
      values: { approved: false },
      basis: APPROVER_BASIS,
    });
  } else {
    const check = checkCertificates(approver, 3, approvalDay, validityYears);
    results.push({
      rule: 'personnel',
      status: check.valid ? 'pass' : 'fail',
      message: check.valid
        ? `Approved by ${approver.name}, ET Level 3, certificate valid ${approvalWhen} (expires ${isoDay(check.valid.expiresOn)}).`
        : `The approver, ${approver.name}, ${list(check.problems)} (judged ${approvalWhen}): a technique must be approved by a Level 3 certified in ET. Have a certified ET Level 3 review and approve it.`,
      values: { approved: true, approverLevel: check.valid?.level ?? null, certificateExpiresOn: check.valid ? isoDay(check.valid.expiresOn) : null },
      basis: APPROVER_BASIS,
    });
  }

  const performers = registers.performers ?? [];
  if (performers.length === 0) {
    results.push({
      rule: 'personnel',
      status: 'warn',
      message: 'No performers are on record for this technique, so their certification cannot be checked.',
      values: { performers: 0 },
      basis: PERFORMER_BASIS,
    });
    return;
  }
  for (const person of performers) results.push(checkPerformer(person, today, validityYears, policy.nearVisionExamMonths));
};

function checkPerformer(person: PersonFact, today: number, validityYears: number, visionMonths: number): RuleResult {
  const check = checkCertificates(person, 2, today, validityYears);
  const problems = [...check.problems];
  const exam = person.nearVisionExamOn ?? null;
  const examDueDay = exam ? utcDayPlusMonths(exam, visionMonths) : null;
  if (!exam) problems.push('has no near-vision exam on record');
  else if (examDueDay !== null && examDueDay < today) problems.push(`had the last near-vision exam on ${isoDay(exam)}, more than ${visionMonths} months ago`);
  const values = {
    person: person.name,
    level: check.valid?.level ?? null,
    certificateExpiresOn: check.valid ? isoDay(check.valid.expiresOn) : null,
    nearVisionExamOn: exam ? isoDay(exam) : null,
  };
  if (problems.length === 0 && check.valid) {
    return {
      rule: 'personnel',
      status: 'pass',
      message: `${person.name}: ET Level ${check.valid.level}, certificate valid until ${isoDay(check.valid.expiresOn)}; near-vision exam ${isoDay(exam as Date)}, within ${visionMonths} months.`,
      values,
      basis: PERFORMER_BASIS,
    };
  }
  return {
    rule: 'personnel',
    status: 'fail',
    message: `${person.name} ${list(problems)}. A person performing ET must hold a valid ET Level 2 or 3 certificate and have passed a near-vision exam within ${visionMonths} months; until then they must not perform this technique.`,
    values,
    basis: PERFORMER_BASIS,
  };
}
