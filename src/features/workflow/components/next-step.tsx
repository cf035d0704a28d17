// What happens next on a record, said at the top of its page: the step, who
// takes it, what still blocks it, and (when the reader may act) the buttons.
// Computed from the record JSON the page already has: its state, the events
// the server allows this reader, and facts such as undecided inspections.
import type { ReactNode } from 'react';
import type { ActionDetailView, AuditDetailView, FindingDetailView } from '../../../../shared/schemas/workflow';
import { stateLabel } from './labels';

export interface NextStep {
  /** The step in words; null when the record is finished. */
  step: string | null;
  /** Who takes it. */
  who: string;
  /** What must happen first, with a link to where it is done on this page. */
  blockers: { text: string; href?: string }[];
}

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

export function findingNextStep(f: FindingDetailView): NextStep {
  switch (f.state) {
    case 'raised':
      return { step: 'Submit the finding for review (or withdraw it)', who: `${f.author?.displayName ?? 'The auditor who raised it'} (auditor)`, blockers: [] };
    case 'in_review':
      return { step: 'Classify the finding: major, minor or observation', who: 'The quality manager', blockers: [] };
    case 'containment': {
      const blockers =
        f.class === 'major' && f.undecidedInspectionCount > 0
          ? [
              {
                text: `Containment: ${plural(f.undecidedInspectionCount, 'past inspection')} still ${f.undecidedInspectionCount === 1 ? 'needs' : 'need'} a decision in the impact worksheet below`,
                href: '#impact-worksheet',
              },
            ]
          : [];
      return { step: 'Record the containment (what was done at once)', who: 'The quality manager', blockers };
    }
    case 'action_open':
      if (!f.action) return { step: 'Assign the corrective action: an owner and a due date', who: 'The quality manager', blockers: [] };
      return {
        step: `Work the corrective action ${f.action.number} (now ${stateLabel(f.action.state).toLowerCase()}) until it is verified`,
        who: `${f.action.owner?.displayName ?? 'Its owner'}, then the quality manager verifies`,
        blockers: [],
      };
    case 'effectiveness_check':
      return { step: 'Check that the correction worked: confirm effective, or not effective to reopen it', who: 'The quality manager', blockers: [] };
    case 'awaiting_signoff':
      return { step: 'Close the finding with an electronic signature', who: 'The accountable manager', blockers: [] };
    case 'closed':
      return { step: null, who: '', blockers: [] };
    case 'withdrawn':
      return { step: null, who: '', blockers: [] };
    default:
      return { step: null, who: '', blockers: [] };
  }
}

export function auditNextStep(a: AuditDetailView): NextStep {
  const lead = `${a.leadAuditor?.displayName ?? 'The lead auditor'} (lead auditor)`;
  switch (a.state) {
    case 'planned':
      return { step: 'Start fieldwork on the planned day', who: lead, blockers: [] };
    case 'fieldwork':
      return { step: 'Run the checklist on each technique in scope, raise findings, then finish fieldwork', who: lead, blockers: [] };
    case 'reporting':
      return { step: 'Issue the audit report', who: lead, blockers: [] };
    case 'issued':
      return {
        step: 'Close the audit',
        who: lead,
        blockers: a.openFindingCount > 0 ? [{ text: `${plural(a.openFindingCount, 'finding')} of this audit ${a.openFindingCount === 1 ? 'is' : 'are'} still open`, href: '#audit-findings' }] : [],
      };
    default:
      return { step: null, who: '', blockers: [] };
  }
}

export function actionNextStep(a: ActionDetailView): NextStep {
  const owner = `${a.owner?.displayName ?? 'The owner'} (action owner)`;
  const extension = a.pendingExtension ? [{ text: `An extension to ${a.pendingExtension.dueDate} waits for the quality manager’s decision` }] : [];
  switch (a.state) {
    case 'assigned':
      return { step: 'Start the root-cause investigation', who: owner, blockers: extension };
    case 'investigating':
      return { step: 'Submit the root cause and the plan', who: owner, blockers: extension };
    case 'plan_review':
      return { step: 'Review the root cause and plan: approve or return it', who: 'The quality manager', blockers: extension };
    case 'in_progress':
      return {
        step: 'Carry out the plan, attach the evidence and submit',
        who: owner,
        blockers: [...extension, ...(a.evidenceCount === 0 ? [{ text: 'No evidence is attached yet', href: '#evidence' }] : [])],
      };
    case 'submitted':
      return { step: 'Verify the corrective action with a signature, or return it', who: 'The quality manager', blockers: [] };
    default:
      return { step: null, who: '', blockers: [] };
  }
}

/** The panel at the top of a record page; `actions` are the reader's buttons, shown only when they may act. */
export function NextStepPanel({ next, state, canAct, actions }: { next: NextStep; state: string; canAct: boolean; actions?: ReactNode }) {
  if (!next.step) {
    return (
      <section aria-label="Next step" className="rounded-lg border border-ink/10 bg-white px-4 py-3 text-sm" data-testid="next-step">
        <p>
          <strong>{stateLabel(state)}.</strong> Nothing more is due on this record.
        </p>
      </section>
    );
  }
  return (
    <section aria-label="Next step" className="rounded-lg border border-lagoon/30 bg-lagoon-soft/40 px-4 py-3 text-sm" data-testid="next-step">
      <p>
        <strong>Next:</strong> {next.step}. <span className="text-ink-soft">Who: {next.who}.</span>
      </p>
      {next.blockers.length > 0 && (
        <ul className="mt-1 list-disc pl-5 font-bold text-fail">
          {next.blockers.map((blocker) => (
            <li key={blocker.text}>
              {blocker.text}
              {blocker.href && (
                <>
                  {' '}
                  <a className="text-lagoon underline" href={blocker.href}>
                    Go there
                  </a>
                </>
              )}
            </li>
          ))}
        </ul>
      )}
      {canAct ? (
        <div className="mt-2">{actions}</div>
      ) : (
        <p className="mt-1 text-ink-soft">
          {next.blockers.length ? 'The step’s button appears here, for the person who takes it, once what blocks it is done.' : 'You have nothing to do on this record now.'}
        </p>
      )}
    </section>
  );
}
