import { defineEntity, type Opt } from '@mikro-orm/core';
import { domePortions, mirrorShapes, type MirrorSpec } from '../../../shared/schemas';
import { BaseRecord, baseProperties } from '../base';
import { Organization } from '../users/organization.entity';

/**
 * A catalogue mirror. Sizes in metres; price in the currency's minor unit (cents).
 * Each organisation owns its items; items with no organisation are the shared demo set, which
 * everyone reads and nobody edits. Codes are unique within an owner.
 */
export class MirrorModel extends BaseRecord {
  organization: Opt<Organization> | null = null;
  code!: string;
  name!: string;
  shape!: MirrorSpec['shape'];
  domePortion: Opt<'full' | 'half' | 'quarter'> | null = null;
  diameterM: Opt<number> | null = null;
  widthM: Opt<number> | null = null;
  heightM: Opt<number> | null = null;
  radiusM: Opt<number> | null = null;
  material: Opt<string> = '';
  reflectance: Opt<number> | null = null;
  massKg: Opt<number> | null = null;
  unitPriceMinor!: number;
  currency!: string;
  notes: Opt<string> = '';
  active: Opt<boolean> = true;
  demo: Opt<boolean> = false;
  version: Opt<number> = 1;

  static readonly schema = defineEntity({
    class: MirrorModel,
    tableName: 'mirror_model',
    uniques: [{ properties: ['organization', 'code'] }],
    properties: (p) => ({
      ...baseProperties(),
      organization: p.manyToOne(Organization.schema).nullable().deleteRule('cascade'),
      code: p.string().length(40),
      name: p.string().length(160),
      shape: p.enum([...mirrorShapes]),
      domePortion: p.enum([...domePortions]).nullable(),
      diameterM: p.float().nullable(),
      widthM: p.float().nullable(),
      heightM: p.float().nullable(),
      radiusM: p.float().nullable(),
      material: p.string().length(80).default(''),
      reflectance: p.float().nullable(),
      massKg: p.float().nullable(),
      unitPriceMinor: p.integer(),
      currency: p.string().length(3),
      notes: p.text().default(''),
      active: p.boolean().default(true),
      demo: p.boolean().default(false),
      version: p.integer().version().default(1),
    }),
  });
}
