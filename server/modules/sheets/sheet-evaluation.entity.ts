import { defineEntity } from '@mikro-orm/core';

/**
 * A project's evaluated sheet content, keyed by the SHA-256 of everything it was computed from (the
 * sheet model's input and SHEET_MODEL_VERSION). The sheet, its status and the e-mail read it here
 * instead of running the engine again; it lives in the database so that several server instances
 * share it. Rows are pruned to the most recently used SHEET_CACHE_ROWS.
 */
export class SheetEvaluation {
  inputHash!: string;
  content!: string;
  contentHash!: string;
  usedAt!: Date;

  static readonly schema = defineEntity({
    class: SheetEvaluation,
    tableName: 'sheet_evaluation',
    properties: (p) => ({
      inputHash: p.string().length(64).primary(),
      content: p.text(),
      contentHash: p.string().length(64),
      usedAt: p.datetime().index(),
    }),
  });
}
