/**
 * Where the selected mirror's editor goes: the placement editor from components/placement, fed the
 * plan's live placement, the plan's write path and the plan's evaluation (one evaluator, cached).
 */
import { PlacementEditor } from '@/components/placement/placement-editor';
import type { PlacementWrites } from '@/hooks/use-placement-writes';
import type { PlanEvaluation } from '@/hooks/use-plan-evaluation';
import type { CatalogueItemDto, PlacementDto, ProjectDto, Scene } from '@/shared/schemas';
import type { UnitSystem } from '@/shared/units';

export interface PlacementEditorSlotProps {
  project: ProjectDto;
  /** The plan's live scene. */
  scene: Scene;
  placement: PlacementDto | null;
  writes: PlacementWrites;
  catalogue: readonly CatalogueItemDto[];
  units: UnitSystem;
  canEdit: boolean;
  evaluation: PlanEvaluation | null;
  onClose: () => void;
}

export function PlacementEditorSlot(props: PlacementEditorSlotProps) {
  return <PlacementEditor {...props} />;
}
