/**
 * The evaluation part of the editor: the live numbers, the side view and the safety cautions, all
 * read from the plan's evaluation (its one cached evaluator); nothing here computes optics.
 */
import { View } from 'react-native';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { SafetyCautions } from '@/components/ui/safety-cautions';
import { plausibilitySentences, type ProjectEvaluation } from '@/shared/project-optics';
import type { PlacementDto, Scene } from '@/shared/schemas';
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
  /** The live placement, for the plausibility sentences (a mirror above its wall, an eye behind it). */
  placement?: Pick<PlacementDto, 'label' | 'positionM' | 'heightM' | 'azimuthRad' | 'tiltDownRad' | 'viewerId'>;
}

export function PlacementLiveNumbers({ placementId, evaluation, scene, units, placement }: PlacementLiveNumbersProps) {
  const own = evaluation?.placements.find((p) => p.placementId === placementId) ?? null;
  const doubts = placement ? plausibilitySentences({ label: placement.label, mirror: own?.mirror ?? null, placement, scene, units }) : [];
  return (
    <>
      <Card title="Live numbers">
        {doubts.length > 0 ? (
          <View testID="placement-plausibility">
            {doubts.map((s) => (
              <Notice key={s} tone="info">
                {s}
              </Notice>
            ))}
          </View>
        ) : null}
        <PlacementNumbersPanel evaluation={own} zones={evaluation?.zones ?? []} scene={scene} units={units} />
      </Card>
      <Card title="Side view">
        <ElevationView evaluation={own} units={units} />
      </Card>
      <SafetyCautions compact />
    </>
  );
}
