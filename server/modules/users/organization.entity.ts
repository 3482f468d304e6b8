import { defineEntity, type Opt } from '@mikro-orm/core';
import { BaseRecord, baseProperties } from '../base';

export class Organization extends BaseRecord {
  name!: string;
  /** True for the invented organisation the demo seeder makes. */
  demo: Opt<boolean> = false;

  static readonly schema = defineEntity({
    class: Organization,
    tableName: 'organization',
    properties: (p) => ({
      ...baseProperties(),
      name: p.string().length(200),
      demo: p.boolean().default(false),
    }),
  });
}
