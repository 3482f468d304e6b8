/** What is selected on the plan, and which tool a tap uses. */
export type PlanSelection =
  { kind: 'placement'; id: number } | { kind: 'viewer'; id: string } | { kind: 'zone'; id: string } | { kind: 'wall'; id: string } | null;

export type PlanTool = 'select' | 'mirror' | 'viewer' | 'zone' | 'wall';
