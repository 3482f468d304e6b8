/**
 * Listens for the plan's keys on the web (see plan-keys.ts for what each does). Native phones
 * have no keyboard to speak of; nothing is attached there.
 */
import { useEffect, useRef } from 'react';
import { planKeyAction, type PlanKeyAction } from './plan-keys';
import type { PlanSelection } from './plan-types';

interface KeyTarget {
  tagName?: string;
  getAttribute?: (name: string) => string | null;
  closest?: (selector: string) => unknown;
}
interface KeyEventLike {
  key: string;
  shiftKey: boolean;
  altKey: boolean;
  ctrlKey: boolean;
  metaKey: boolean;
  target: unknown;
  defaultPrevented: boolean;
  preventDefault(): void;
}
interface KeyDocument {
  addEventListener(type: 'keydown', fn: (e: KeyEventLike) => void): void;
  removeEventListener(type: 'keydown', fn: (e: KeyEventLike) => void): void;
}

export function usePlanKeys(selection: PlanSelection, canEdit: boolean, run: (action: NonNullable<PlanKeyAction>) => void): void {
  const latest = useRef({ selection, canEdit, run });
  useEffect(() => {
    latest.current = { selection, canEdit, run };
  });
  useEffect(() => {
    const doc = (globalThis as { document?: KeyDocument }).document;
    if (!doc) return;
    const onKey = (e: KeyEventLike) => {
      if (e.defaultPrevented) return;
      const t = (e.target ?? {}) as KeyTarget;
      const action = planKeyAction(
        {
          key: e.key,
          shiftKey: e.shiftKey,
          altKey: e.altKey,
          ctrlKey: e.ctrlKey,
          metaKey: e.metaKey,
          targetTag: t.tagName ?? '',
          targetRole: t.getAttribute?.('role') ?? null,
          inDialog: Boolean(t.closest?.('[role="dialog"],[role="alertdialog"]')),
        },
        latest.current.selection,
        latest.current.canEdit,
      );
      if (!action) return;
      e.preventDefault();
      latest.current.run(action);
    };
    doc.addEventListener('keydown', onKey);
    return () => doc.removeEventListener('keydown', onKey);
  }, []);
}
