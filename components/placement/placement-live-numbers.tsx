/**
 * The evaluation part of the editor: the live numbers, the side view and the safety cautions, all
 * read from the plan's evaluation (its one cached evaluator); nothing here computes optics.
 */
import { Card } from '@/components/ui/card';
import { SafetyCautions } from '@/components/ui/safety-cautions';
import type { ProjectEvaluation } from '@/shared/project-optics';
import type { Scene } from '@/shared/schemas';
import type { UnitSystem } from '@/shared/units';
import { ElevationView } from './elevation-view';
import { PlacementNumbersPanel } from './numbers-panel';

export interface PlacementLiveNumbersProps {
  placementId: number;
  /** The plan's evaluation, which already includes this mirror's unsaved values; null while there is none. */
  evaluation: ProjectEvaluation | null;
  /** The plan's live scene (the zones the fractions belong to). */
  scene: Scene;
  units: UnitSystem;
}

export function PlacementLiveNumbers({ placementId, evaluation, scene, units }: PlacementLiveNumbersProps) {
  const own = evaluation?.placements.find((p) => p.placementId === placementId) ?? null;
  return (
    <>
      <Card title="Live numbers">
        <PlacementNumbersPanel evaluation={own} zones={evaluation?.zones ?? []} scene={scene} units={units} />
      </Card>
      <Card title="Side view">
        <ElevationView evaluation={own} units={units} />
      </Card>
      <SafetyCautions compact />
    </>
  );
}
