import type { PlacementDto, ProjectDto, ProjectSummaryDto } from '../../../shared/schemas';
import type { Placement } from './placement.entity';
import type { Project } from './project.entity';

export function toPlacementDto(p: Placement): PlacementDto {
  return {
    id: p.id,
    projectId: p.project.id,
    label: p.label,
    catalogueItemId: p.catalogueItem?.id ?? null,
    customMirror: p.customMirror,
    positionM: [p.xM, p.yM],
    heightM: p.heightM,
    azimuthRad: p.azimuthRad,
    tiltDownRad: p.tiltDownRad,
    viewerId: p.viewerId,
    notes: p.notes,
    mirrorClass: p.mirrorClass,
    servesFieldIds: p.servesFieldIds,
    version: p.version,
    updatedAt: p.updatedAt.toISOString(),
  };
}

export function toProjectSummaryDto(p: Project, placementCount: number): ProjectSummaryDto {
  return {
    id: p.id,
    name: p.name,
    customer: p.customer,
    site: p.site,
    kind: p.kind,
    status: p.status,
    ownerId: p.owner.id,
    ownerName: p.owner.name,
    placementCount,
    version: p.version,
    createdAt: p.createdAt.toISOString(),
    updatedAt: p.updatedAt.toISOString(),
  };
}

export function toProjectDto(p: Project, placements: Placement[], canEdit: boolean): ProjectDto {
  return {
    ...toProjectSummaryDto(p, placements.length),
    units: p.units,
    notes: p.notes,
    scene: p.scene,
    placements: placements.map(toPlacementDto),
    canEdit,
  };
}
