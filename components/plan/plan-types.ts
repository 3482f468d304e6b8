/** What is selected on the plan, and which tool a tap uses. */
export type PlanSelection =
  | { kind: 'placement'; id: number }
  | { kind: 'viewer'; id: string }
  | { kind: 'zone'; id: string }
  | { kind: 'wall'; id: string }
  | null;

export type PlanTool = 'select' | 'mirror' | 'viewer' | 'zone' | 'wall';

export const sameSelection = (a: PlanSelection, b: PlanSelection): boolean => (a === null || b === null ? a === b : a.kind === b.kind && a.id === b.id);
