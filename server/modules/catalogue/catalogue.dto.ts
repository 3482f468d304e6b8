import type { CatalogueItemDto, MirrorSpec } from '../../../shared/schemas';
import type { MirrorModel } from './mirror-model.entity';

/** The engine's mirror description of a catalogue row. */
export function mirrorOfModel(m: MirrorModel): MirrorSpec {
  if (m.shape === 'dome') return { shape: 'dome', portion: m.domePortion ?? 'full', diameterM: m.diameterM ?? 0 };
  if (m.shape === 'rect') return { shape: 'rect', widthM: m.widthM ?? 0, heightM: m.heightM ?? 0, radiusM: m.radiusM ?? 0 };
  return { shape: 'round', diameterM: m.diameterM ?? 0, radiusM: m.radiusM ?? 0 };
}

/** Spreads a mirror description over the row's columns (the others cleared). */
export function assignMirror(m: MirrorModel, spec: MirrorSpec): void {
  m.shape = spec.shape;
  m.domePortion = spec.shape === 'dome' ? spec.portion : null;
  m.diameterM = spec.shape === 'rect' ? null : spec.diameterM;
  m.widthM = spec.shape === 'rect' ? spec.widthM : null;
  m.heightM = spec.shape === 'rect' ? spec.heightM : null;
  m.radiusM = spec.shape === 'dome' ? null : spec.radiusM;
}

export function toCatalogueItemDto(m: MirrorModel): CatalogueItemDto {
  return {
    id: m.id,
    code: m.code,
    name: m.name,
    mirror: mirrorOfModel(m),
    material: m.material,
    reflectance: m.reflectance,
    massKg: m.massKg,
    unitPriceMinor: m.unitPriceMinor,
    currency: m.currency,
    notes: m.notes,
    active: m.active,
    demo: m.demo,
    version: m.version,
    updatedAt: m.updatedAt.toISOString(),
  };
}
