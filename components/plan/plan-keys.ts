/**
 * What a key pressed over the plan does on a wide screen (pure, so it is tested without a page):
 * Escape closes the editor (clears the selection), the arrow keys nudge the selected mirror or
 * viewer by a step on the plan (Shift for a larger step). Keys typed into a field, a button or a
 * dialog are theirs, not the plan's.
 */
import type { PlanSelection } from './plan-types';
import type { PairM } from './plan-view';

/** A nudge moves by 0.1 m, or 1 m with Shift: the plan's own rounding (plan-edits.ts roundM) keeps centimetres. */
export const NUDGE_STEP_M = 0.1;
export const NUDGE_STEP_SHIFT_M = 1;

export type PlanKeyAction = { kind: 'close' } | { kind: 'nudge'; deltaM: PairM } | null;

export interface PlanKeyEvent {
  key: string;
  shiftKey: boolean;
  altKey: boolean;
  ctrlKey: boolean;
  metaKey: boolean;
  /** The focused element's tag name and role, if any. */
  targetTag: string;
  targetRole: string | null;
  /** Whether the key was typed inside a dialog (the zone name prompt, a confirmation). */
  inDialog: boolean;
}

const TYPING_TAGS = new Set(['INPUT', 'TEXTAREA', 'SELECT']);
const KEY_OWNING_ROLES = new Set(['textbox', 'slider', 'radiogroup', 'radio', 'table', 'row', 'spinbutton', 'combobox', 'listbox']);

const ARROWS: Record<string, PairM> = { ArrowLeft: [-1, 0], ArrowRight: [1, 0], ArrowUp: [0, 1], ArrowDown: [0, -1] };

export function planKeyAction(e: PlanKeyEvent, selection: PlanSelection, canEdit: boolean): PlanKeyAction {
  if (e.inDialog || e.altKey || e.ctrlKey || e.metaKey) return null;
  const tag = e.targetTag.toUpperCase();
  // Escape closes the editor from its one-line fields too; a text area (a comment, a reason) keeps it.
  if (e.key === 'Escape') return selection && tag !== 'TEXTAREA' ? { kind: 'close' } : null;
  if (TYPING_TAGS.has(tag) || (e.targetRole !== null && KEY_OWNING_ROLES.has(e.targetRole))) return null;
  const arrow = ARROWS[e.key];
  if (!arrow || !canEdit) return null;
  if (selection?.kind !== 'placement' && selection?.kind !== 'viewer') return null;
  const step = e.shiftKey ? NUDGE_STEP_SHIFT_M : NUDGE_STEP_M;
  return { kind: 'nudge', deltaM: [arrow[0] * step, arrow[1] * step] };
}
