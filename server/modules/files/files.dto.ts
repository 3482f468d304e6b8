import type { FileDto } from '../../../shared/schemas/files';
import type { StoredFile } from './stored-file.entity';

export function toFileDto(f: StoredFile): FileDto {
  return {
    id: f.id,
    projectId: f.project.id,
    kind: f.kind,
    contentType: f.contentType,
    bytes: f.bytes,
    name: f.name,
    widthPx: f.widthPx,
    heightPx: f.heightPx,
    placementId: f.placement?.id ?? null,
    sourcePage: f.sourcePage,
    sourcePages: f.sourcePages,
    createdAt: f.createdAt.toISOString(),
    url: `/api/files/${f.id}`,
    thumbnailUrl: `/api/files/${f.id}/thumbnail`,
  };
}
