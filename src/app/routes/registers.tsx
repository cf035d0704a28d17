import { NavLink, Navigate, useParams } from 'react-router-dom';
import { PageHeader } from '../../components/ui/states';
import { CertificationsTable } from '../../features/registers/components/certifications-table';
import { EquipmentTable } from '../../features/registers/components/equipment-table';
import { TechniqueLinksPanel } from '../../features/registers/components/technique-links-panel';
import { EvidencePanel } from '../../features/evidence/components/evidence-panel';
import { InspectionsPanel } from '../../features/inspections/components/inspections-panel';

const TABS = [
  { id: 'certifications', label: 'Personnel certifications' },
  { id: 'equipment', label: 'Equipment' },
  { id: 'technique-links', label: 'Technique links' },
  { id: 'inspections', label: 'Inspections' },
] as const;

export function Component() {
  const { tab } = useParams();
  if (!tab) return <Navigate to="/registers/certifications" replace />;
  if (!TABS.some((t) => t.id === tab)) return <Navigate to="/registers/certifications" replace />;
  return (
    <div>
      <PageHeader title="Registers" />
      <nav aria-label="Registers" className="mb-4 flex gap-1 border-b border-ink/10">
        {TABS.map((t) => (
          <NavLink
            key={t.id}
            to={`/registers/${t.id}`}
            className={({ isActive }) =>
              `-mb-px rounded-t-md border px-3 py-1.5 text-sm font-bold ${isActive ? 'border-ink/10 border-b-paper bg-paper text-ink' : 'border-transparent text-ink-soft hover:text-ink'}`
            }
          >
            {t.label}
          </NavLink>
        ))}
      </nav>
      {tab === 'certifications' ? (
        <>
          <p className="mb-3 max-w-3xl text-sm text-ink-soft">
            A person performing ET needs a valid ET Level 2 or 3 certificate and a near-vision exam within the policy period; a technique needs a
            certified ET Level 3's approval. The technique checklist reads this register.
          </p>
          <CertificationsTable
            evidencePanel={(certification) => (
              <EvidencePanel recordType="certification" recordId={certification.id} recordOwnerId={certification.userId} title="Certificate and vision-exam evidence" />
            )}
          />
        </>
      ) : tab === 'equipment' ? (
        <>
          <p className="mb-3 max-w-3xl text-sm text-ink-soft">
            Instruments, probes and reference standards must be within calibration when used. Quarantined and retired items are kept with their history.
          </p>
          <EquipmentTable />
        </>
      ) : tab === 'inspections' ? (
        <>
          <p className="mb-3 max-w-3xl text-sm text-ink-soft">
            Every inspection performed to an approved technique revision: the part, the work order, who did it, the result and the equipment used. When a
            finding puts a revision in doubt, this register says which parts to look at again.
          </p>
          <InspectionsPanel />
        </>
      ) : (
        <>
          <p className="mb-3 max-w-3xl text-sm text-ink-soft">
            The equipment and people each technique uses. The technique checklist judges them: the performers' ET certificates and near-vision exams,
            and the calibration of every instrument, probe and reference standard linked here.
          </p>
          <TechniqueLinksPanel />
        </>
      )}
    </div>
  );
}
