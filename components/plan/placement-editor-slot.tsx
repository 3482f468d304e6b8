/**
 * Where the selected mirror's editor goes: the placement editor from components/placement, given
 * the project as the plan shows it (with edits made on the plan that are still saving).
 */
import { PlacementEditor } from '@/components/placement/placement-editor';
import type { PlanEvaluation } from '@/hooks/use-plan-evaluation';
import type { CatalogueItemDto, ProjectDto, Scene } from '@/shared/schemas';
import type { UnitSystem } from '@/shared/units';

export interface PlacementEditorSlotProps {
  project: ProjectDto;
  placementId: number;
  catalogue: readonly CatalogueItemDto[];
  units: UnitSystem;
  canEdit: boolean;
  evaluation: PlanEvaluation | null;
  scene: Scene;
  onClose: () => void;
}

export function PlacementEditorSlot({ project, placementId, catalogue, units, canEdit, onClose }: PlacementEditorSlotProps) {
  return <PlacementEditor project={project} placementId={placementId} catalogue={catalogue} units={units} canEdit={canEdit} onClose={onClose} />;
}
