/**
 * What a site plan's workspace and a vehicle job's workspace share: the breakpoint, the person's
 * units, the plan's edits (one write path), closing the redraw measure of a live drag, the header,
 * the notices over the plan, a mirror's drag as a preview then one save, and the choice between
 * the wide and the phone arrangement (workspace-layouts.tsx). Tools, details and what a tap does
 * stay with each workspace.
 */
import { useLayoutEffect, type ReactNode } from 'react';
import { useDisplayUnits } from '@/components/placement/use-display-units';
import { useIsWide } from '@/hooks/use-breakpoint';
import { usePlanEdits, type PlacementPatch } from '@/hooks/use-plan-edits';
import type { CatalogueItemDto, ProjectDto } from '@/shared/schemas';
import type { UnitSystem } from '@/shared/units';
import { markRedrawEnd } from './perf-marks';
import { placementDragPatch } from './plan-edits';
import { PlanNotices } from './plan-notices';
import type { PairM } from './plan-view';
import { WorkspaceHeader } from './workspace-header';
import { PhoneWorkspace, WideWorkspace, type WorkspaceParts } from './workspace-layouts';

export type PlanEdits = ReturnType<typeof usePlanEdits>;

export function useWorkspaceBase(project: ProjectDto) {
  const wide = useIsWide();
  const units = useDisplayUnits(project);
  const edits = usePlanEdits(project);
  // Closes the performance measure of a live drag frame once React has committed it.
  useLayoutEffect(() => {
    if (edits.dragPreview) markRedrawEnd();
  }, [edits.dragPreview]);
  const header = (
    <WorkspaceHeader project={project} wide={wide} saving={edits.saving} failed={edits.problem !== null} unsaved={edits.unsaved} />
  );
  return { wide, units, edits, header };
}

/** A mirror's drag: previewed while it moves, saved once (rounded) when it ends. */
export function dragPlacement(
  edits: Pick<PlanEdits, 'setDragPreview'>,
  save: (id: number, patch: PlacementPatch) => void,
  d: { id: number; done: boolean } & ({ positionM: PairM } | { azimuthRad: number }),
): void {
  const patch = placementDragPatch(d);
  if (!d.done) return edits.setDragPreview({ kind: 'placement', id: d.id, patch });
  edits.setDragPreview(null);
  save(d.id, patch);
}

/** The notices over the plan for the current edits (save problems, conflicts) and the tool's sentence. */
export function EditNotices(p: {
  edits: PlanEdits;
  editorOpenFor: number | null;
  toolProblem: string | null;
  catalogue: readonly CatalogueItemDto[];
  units: UnitSystem;
}) {
  return (
    <PlanNotices
      saveProblem={p.edits.problem}
      onDismissSaveProblem={p.edits.dismissProblem}
      writes={p.edits.writes}
      placements={p.edits.placements}
      editorOpenFor={p.editorOpenFor}
      toolProblem={p.toolProblem}
      catalogue={p.catalogue}
      units={p.units}
    />
  );
}

/** Wide: the details in the side panel. Phone: the details inside the drawer. */
export function ResponsiveWorkspace(
  p: Omit<WorkspaceParts, 'details'> & { wide: boolean; details: ReactNode; drawerOpen: boolean; drawer: ReactNode },
) {
  const { wide, details, drawerOpen, drawer, ...parts } = p;
  if (wide) return <WideWorkspace {...parts} details={details} />;
  return <PhoneWorkspace {...parts} drawerOpen={drawerOpen} drawer={drawer} />;
}
