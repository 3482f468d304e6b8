import { defineEntity, type Opt } from '@mikro-orm/core';

/** id and timestamps shared by the app's entities. */
export abstract class BaseRecord {
  id!: number;
  createdAt: Opt<Date> = new Date();
  updatedAt: Opt<Date> = new Date();
}

export const baseProperties = () => {
  const p = defineEntity.properties;
  return {
    id: p.integer().primary().autoincrement(),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
  };
};
