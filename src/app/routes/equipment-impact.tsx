import { useParams } from 'react-router-dom';
import { EquipmentImpactPage } from '../../features/impact/components/equipment-impact-page';

export function Component() {
  const { id } = useParams();
  return <EquipmentImpactPage key={id} equipmentId={Number(id)} />;
}
