/**
 * The content hash: SHA-256 over the job's engineering content only — what a reviewer approves.
 * In: the kind (site or vehicle), name, customer, site, notes, the scene (walls, zones, viewers,
 * criteria, a vehicle), and each mirror with its optical spec and mounting. Out: the display
 * units, the paper, prices, the installer's own settings, ids and dates. So printing the same job
 * in other units or on other paper is the same revision and keeps its approval.
 */
import { createHash } from 'node:crypto';
import type { SheetInput } from '../../pdf/sheet-model';
import { canonicalJson } from '../../pdf/sheet-model';

export function engineeringContent(input: SheetInput) {
  const byId = new Map(input.catalogue.map((c) => [c.id, c]));
  return {
    kind: input.project.kind,
    name: input.project.name,
    customer: input.project.customer,
    site: input.project.site,
    notes: input.project.notes,
    scene: input.project.scene,
    mirrors: input.placements.map((p) => {
      const item = p.catalogueItemId != null ? byId.get(p.catalogueItemId) : undefined;
      return {
        label: p.label,
        catalogue: item ? { code: item.code, reflectance: item.reflectance } : null,
        mirror: p.customMirror ?? item?.mirror ?? null,
        positionM: p.positionM,
        heightM: p.heightM,
        azimuthRad: p.azimuthRad,
        tiltDownRad: p.tiltDownRad,
        viewerId: p.viewerId,
        notes: p.notes,
      };
    }),
  };
}

export function engineeringHash(input: SheetInput): string {
  return createHash('sha256')
    .update(canonicalJson(engineeringContent(input)))
    .digest('hex');
}
