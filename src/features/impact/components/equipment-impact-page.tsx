// The impact view from an item of equipment: an instrument, probe or reference
// standard found out of calibration puts in doubt the inspections made with it
// since its last good calibration (or since a date chosen).
import { EQUIPMENT_USE_STATUS_LABELS, equipmentUseStatus } from '../../../../shared/registers/flags';
import { useState, type FormEvent } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { CsvExportLink } from '../../../components/ui/export-links';
import { TextField } from '../../../components/ui/field';
import { Panel } from '../../../components/ui/panel';
import { ErrorNotice, Loading, PageHeader } from '../../../components/ui/states';
import { useEquipmentImpact } from '../api/impact';
import { ImpactGroups, groupKey } from './impact-groups';
import { InspectionRowsTable } from './inspection-rows-table';

export function EquipmentImpactPage({ equipmentId }: { equipmentId: number }) {
  const [params, setParams] = useSearchParams();
  const since = params.get('since');
  const impact = useEquipmentImpact(equipmentId, since);
  const [group, setGroup] = useState<string | null>(null);

  if (impact.isLoading) return <Loading what="Loading the inspections made with this item" />;
  if (impact.error || !impact.data) return <ErrorNotice error={impact.error} title="The inspections could not be loaded" />;
  const view = impact.data;
  const rows = view.rows.filter((row) => !group || groupKey(row.inspection) === group);
  const chooseSince = (value: string | null) =>
    setParams((current) => {
      const next = new URLSearchParams(current);
      if (value) next.set('since', value);
      else next.delete('since');
      return next;
    });

  return (
    <div className="flex flex-col gap-4">
      <PageHeader title={`Inspections made with ${view.equipment.serialNumber}`}>
        <CsvExportLink path={`/equipment/${equipmentId}/impact.csv`} query={since ? { since } : {}} label="Export CSV" />
      </PageHeader>
      <p className="text-sm">
        <Link className="text-lagoon underline" to="/registers/equipment">Equipment register</Link> · {view.equipment.description} · status{' '}
        {EQUIPMENT_USE_STATUS_LABELS[equipmentUseStatus(view.equipment.status, view.equipment.calibrationDueOn, new Date())]} · calibrated {view.equipment.calibratedOn ?? '—'}, due {view.equipment.calibrationDueOn ?? '—'}
      </p>
      <Panel title="Inspections in doubt">
        <div className="flex flex-col gap-3 text-sm">
          <p>
            <strong>{view.total}</strong> inspection(s) {view.basis}.
          </p>
          <SinceForm key={since ?? ''} since={since} onChoose={chooseSince} />
          <ImpactGroups groups={view.groups} chosen={group} onChoose={setGroup} />
          <InspectionRowsTable rows={rows} caption={`Inspections made with ${view.equipment.serialNumber}`} withDecisions={false} />
          <p className="text-ink-soft">
            Decisions on these inspections are recorded on a finding: raise one against the technique (or the equipment) and decide each inspection on its
            impact worksheet.
          </p>
        </div>
      </Panel>
    </div>
  );
}

function SinceForm({ since, onChoose }: { since: string | null; onChoose(value: string | null): void }) {
  const [value, setValue] = useState(since ?? '');
  const submit = (event: FormEvent) => {
    event.preventDefault();
    onChoose(value || null);
  };
  return (
    <form onSubmit={submit} className="flex flex-wrap items-end gap-2">
      <div className="w-48">
        <TextField label="List inspections from" type="date" value={value} onChange={(event) => setValue(event.target.value)} hint="Empty: since the last calibration" />
      </div>
      <Button type="submit" variant="secondary">Apply</Button>
      {since && <Button variant="ghost" onClick={() => onChoose(null)}>Since the last calibration</Button>}
    </form>
  );
}
