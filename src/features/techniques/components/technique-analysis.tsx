// The checklist with its plot and diagram, for a technique already evaluated
// (live in the editor, or by the server for a stored revision).
import type { ChecklistOutput, Technique } from '../../../../shared/domain/checklist';
import { ChecklistPanel } from './checklist-panel';
import { DepthPlot } from './depth-plot';
import { FrameDiagram } from './frame-diagram';
import { ImpedancePlaneDiagram } from './impedance-plane';
import { DensityMapPanel } from './density-map';

export function TechniqueAnalysis({ technique, output, title, note }: { technique: Technique; output: ChecklistOutput; title?: string; note?: React.ReactNode }) {
  return (
    <div className="flex flex-col gap-4">
      <ChecklistPanel output={output} technique={technique} title={title} note={note} />
      <DepthPlot technique={technique} values={output.values} penetrationFactor={output.policy.penetrationDepthFactor} />
      <ImpedancePlaneDiagram technique={technique} values={output.values} separationMinDeg={output.policy.phaseSeparationMinDeg} />
      <DensityMapPanel technique={technique} values={output.values} />
      <FrameDiagram technique={technique} values={output.values} threshold={output.policy.orientationSensitivityMin} />
    </div>
  );
}
