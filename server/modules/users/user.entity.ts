import { defineEntity, type Opt } from '@mikro-orm/core';
import type { Role, UnitSystem } from '../../../shared/schemas';
import { roles, unitSystems } from '../../../shared/schemas';
import { BaseRecord, baseProperties } from '../base';
import { Organization } from './organization.entity';

export class User extends BaseRecord {
  organization!: Organization;
  email!: string;
  name!: string;
  /** bcrypt hash; null until an invited person sets a password. Hidden from JSON, loaded on demand. */
  passwordHash: Opt<string> | null = null;
  role!: Role;
  disabled: Opt<boolean> = false;
  units: Opt<UnitSystem> = 'metric';

  static readonly schema = defineEntity({
    class: User,
    tableName: 'user',
    properties: (p) => ({
      ...baseProperties(),
      organization: p.manyToOne(Organization.schema),
      email: p.string().length(254).unique(),
      name: p.string().length(120),
      passwordHash: p.string().length(100).nullable().hidden().lazy(true, false),
      role: p.enum([...roles]),
      disabled: p.boolean().default(false),
      units: p.enum([...unitSystems]).default('metric'),
    }),
  });
}
