// Register flags in words and colour together (never colour alone).
import { CALIBRATION_STATUS_LABELS, type CalibrationFlag, type CertificateFlag, type VisionFlag } from '../../../../shared/registers/flags';

type Tone = 'fail' | 'warn' | 'pass' | 'muted';

const TONES: Record<Tone, string> = {
  fail: 'border-fail/40 bg-red-50 text-fail',
  warn: 'border-warn/40 bg-amber-50 text-warn',
  pass: 'border-pass/30 bg-green-50 text-pass',
  muted: 'border-ink/20 bg-paper text-ink-soft',
};

function Badge({ tone, children }: { tone: Tone; children: string }) {
  return <span className={`inline-block rounded border px-1.5 py-0.5 text-xs font-bold ${TONES[tone]}`}>{children}</span>;
}

const days = (n: number) => `${n} ${Math.abs(n) === 1 ? 'day' : 'days'}`;

export function CertificateBadge({ flag }: { flag: CertificateFlag }) {
  switch (flag.status) {
    case 'expired':
      return <Badge tone="fail">{`Expired ${days(-flag.daysLeft)} ago`}</Badge>;
    case 'expires-30':
      return <Badge tone="fail">{flag.daysLeft === 0 ? 'Expires today' : `Expires in ${days(flag.daysLeft)}`}</Badge>;
    case 'expires-60':
      return <Badge tone="warn">{`Expires in ${days(flag.daysLeft)}`}</Badge>;
    default:
      return <Badge tone="pass">Valid</Badge>;
  }
}

export function VisionBadge({ flag }: { flag: VisionFlag }) {
  switch (flag.status) {
    case 'missing':
      return <Badge tone="fail">No exam on record</Badge>;
    case 'overdue':
      return <Badge tone="fail">{`Overdue since ${flag.dueOn}`}</Badge>;
    case 'due-soon':
      return <Badge tone="warn">{`Due by ${flag.dueOn}`}</Badge>;
    default:
      return <Badge tone="pass">{`Current to ${flag.dueOn}`}</Badge>;
  }
}

export function CalibrationBadge({ flag, status }: { flag: CalibrationFlag; status: string }) {
  if (status === 'retired') return <Badge tone="muted">Retired</Badge>;
  if (status === 'quarantined') return <Badge tone="fail">Quarantined</Badge>;
  switch (flag.status) {
    case 'none':
      return <Badge tone="fail">No calibration record</Badge>;
    case 'overdue':
      return <Badge tone="fail">{`${CALIBRATION_STATUS_LABELS.overdue}: due date passed ${days(-(flag.daysLeft ?? 0))} ago`}</Badge>;
    case 'due-soon':
      return <Badge tone="warn">{`Due in ${days(flag.daysLeft ?? 0)}`}</Badge>;
    default:
      return <Badge tone="pass">{CALIBRATION_STATUS_LABELS.ok}</Badge>;
  }
}
