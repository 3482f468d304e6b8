import type { PlacementDto, ProjectDto, ProjectSummaryDto, ReviewFieldsDto } from '../../../shared/schemas';
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
    version: p.version,
    updatedAt: p.updatedAt.toISOString(),
  };
}

/** The review fields of a project (the reviewer must be populated when set). */
export function toReviewFields(p: Project, openCommentCount: number): ReviewFieldsDto {
  const approved = p.state === 'approved' && p.approvedAt && p.approvedRevision != null && p.approvedHash;
  return {
    state: p.state,
    reviewerId: p.reviewer?.id ?? null,
    reviewerName: p.reviewer?.name ?? null,
    sentAt: p.sentAt?.toISOString() ?? null,
    approval: approved
      ? {
          reviewerId: p.approvedBy?.id ?? 0,
          reviewerName: p.approvedByName ?? '',
          reviewerRole: p.approvedByRole ?? '',
          approvedAt: p.approvedAt!.toISOString(),
          revision: p.approvedRevision!,
          contentHash: p.approvedHash!,
        }
      : null,
    openCommentCount,
  };
}

export function toProjectSummaryDto(p: Project, placementCount: number, openCommentCount = 0): ProjectSummaryDto {
  return {
    ...toReviewFields(p, openCommentCount),
    id: p.id,
    name: p.name,
    customer: p.customer,
    site: p.site,
    kind: p.kind,
    ownerId: p.owner.id,
    ownerName: p.owner.name,
    placementCount,
    version: p.version,
    createdAt: p.createdAt.toISOString(),
    updatedAt: p.updatedAt.toISOString(),
  };
}

export function toProjectDto(p: Project, placements: Placement[], canEdit: boolean, openCommentCount = 0): ProjectDto {
  return {
    ...toProjectSummaryDto(p, placements.length, openCommentCount),
    units: p.units,
    notes: p.notes,
    scene: p.scene,
    placements: placements.map(toPlacementDto),
    canEdit,
  };
}
