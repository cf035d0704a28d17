// Which instruments, probes, reference standards and people a technique uses.
// The technique checklist's `equipment` and `personnel` rules are judged on these links.
import { useEffect, useState } from 'react';
import { EQUIPMENT_KIND_LABELS, EQUIPMENT_KIND_VALUES } from '../../../../shared/schemas/equipment';
import { Button } from '../../../components/ui/button';
import { EmptyState, ErrorNotice, Loading } from '../../../components/ui/states';
import { useAbility } from '../../../lib/ability';
import { usePeople } from '../api/certifications';
import { useEquipment } from '../api/equipment';
import { useSetTechniqueLinks, useTechniqueLinks, useTechniqueList } from '../api/technique-links';
import { CalibrationBadge } from './flag-badge';

const selectClass = 'rounded-md border border-ink/25 bg-white px-2 py-1.5 text-sm';

function LinksEditor({ techniqueId }: { techniqueId: number }) {
  const ability = useAbility();
  const canEdit = ability.can('create', 'Technique') || ability.can('update', 'Equipment');
  const links = useTechniqueLinks(techniqueId);
  const equipment = useEquipment({ pageSize: 200, sort: 'description' });
  const people = usePeople();
  const save = useSetTechniqueLinks(techniqueId);
  const [equipmentIds, setEquipmentIds] = useState<number[]>([]);
  const [performerIds, setPerformerIds] = useState<number[]>([]);
  const [editing, setEditing] = useState(false);

  useEffect(() => {
    if (!links.data) return;
    setEquipmentIds(links.data.equipment.map((item) => item.id));
    setPerformerIds(links.data.performers.map((person) => person.id));
  }, [links.data]);

  if (links.isLoading) return <Loading what="Loading the links" />;
  if (links.error || !links.data) return <ErrorNotice error={links.error} title="The links could not be loaded" />;
  const toggle = (list: number[], id: number, on: boolean) => (on ? [...new Set([...list, id])] : list.filter((value) => value !== id));

  if (!editing) {
    return (
      <div className="flex flex-col gap-3">
        <div className="grid gap-3 md:grid-cols-2">
          <div>
            <h3 className="text-sm font-bold">Equipment</h3>
            {links.data.equipment.length === 0 ? (
              <p className="text-sm text-ink-soft">None linked: the checklist warns that calibration cannot be checked.</p>
            ) : (
              <ul className="mt-1 flex flex-col gap-1 text-sm">
                {links.data.equipment.map((item) => (
                  <li key={item.id} className="flex flex-wrap items-center gap-2">
                    <span>
                      {EQUIPMENT_KIND_LABELS[item.kind]}: {item.description} (s/n {item.serialNumber})
                    </span>
                    <CalibrationBadge flag={item.calibration} status={item.status} />
                  </li>
                ))}
              </ul>
            )}
          </div>
          <div>
            <h3 className="text-sm font-bold">People who perform it</h3>
            {links.data.performers.length === 0 ? (
              <p className="text-sm text-ink-soft">None linked: the checklist warns that certification cannot be checked.</p>
            ) : (
              <ul className="mt-1 text-sm">
                {links.data.performers.map((person) => (
                  <li key={person.id}>{person.displayName}</li>
                ))}
              </ul>
            )}
          </div>
        </div>
        {canEdit && (
          <div>
            <Button variant="secondary" onClick={() => setEditing(true)}>
              Change links
            </Button>
          </div>
        )}
      </div>
    );
  }

  return (
    <form
      className="flex flex-col gap-3"
      onSubmit={(event) => {
        event.preventDefault();
        save.mutate({ equipmentIds, performerIds }, { onSuccess: () => setEditing(false) });
      }}
    >
      <div className="grid gap-4 md:grid-cols-2">
        <fieldset className="flex flex-col gap-1">
          <legend className="text-sm font-bold">Equipment</legend>
          {EQUIPMENT_KIND_VALUES.map((kind) => (
            <div key={kind} className="mt-1">
              <p className="text-xs font-bold uppercase text-ink-soft">{EQUIPMENT_KIND_LABELS[kind]}</p>
              {equipment.data?.items
                .filter((item) => item.kind === kind)
                .map((item) => (
                  <label key={item.id} className="flex items-center gap-2 text-sm">
                    <input type="checkbox" checked={equipmentIds.includes(item.id)} onChange={(e) => setEquipmentIds(toggle(equipmentIds, item.id, e.target.checked))} />
                    {item.description} (s/n {item.serialNumber})
                    <CalibrationBadge flag={item.calibration} status={item.status} />
                  </label>
                ))}
            </div>
          ))}
        </fieldset>
        <fieldset className="flex flex-col gap-1">
          <legend className="text-sm font-bold">People who perform it</legend>
          {people.data?.items.map((person) => (
            <label key={person.id} className="flex items-center gap-2 text-sm">
              <input type="checkbox" checked={performerIds.includes(person.id)} onChange={(e) => setPerformerIds(toggle(performerIds, person.id, e.target.checked))} />
              {person.displayName}
            </label>
          ))}
        </fieldset>
      </div>
      {save.error ? <ErrorNotice error={save.error} title="Not saved" /> : null}
      <div className="flex gap-2">
        <Button type="submit" busy={save.isPending} busyLabel="Saving…">
          {'Save links'}
        </Button>
        <Button variant="secondary" onClick={() => setEditing(false)}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

export function TechniqueLinksPanel() {
  const techniques = useTechniqueList();
  const [techniqueId, setTechniqueId] = useState<number | null>(null);
  if (techniques.isLoading) return <Loading what="Loading the techniques" />;
  if (techniques.error) return <ErrorNotice error={techniques.error} title="The techniques could not be loaded" />;
  const items = techniques.data?.items ?? [];
  if (items.length === 0) return <EmptyState title="No techniques in the register yet" />;
  return (
    <div className="flex flex-col gap-4 rounded-lg border border-ink/10 bg-white p-4">
      <label className="flex flex-col gap-1 text-sm font-bold">
        Technique
        <select className={selectClass} value={techniqueId ?? ''} onChange={(e) => setTechniqueId(e.target.value ? Number(e.target.value) : null)}>
          <option value="">Choose a technique…</option>
          {items.map((technique) => (
            <option key={technique.id} value={technique.id}>
              {technique.code} rev {technique.revision}: {technique.title}
            </option>
          ))}
        </select>
      </label>
      {techniqueId !== null && <LinksEditor key={techniqueId} techniqueId={techniqueId} />}
    </div>
  );
}
