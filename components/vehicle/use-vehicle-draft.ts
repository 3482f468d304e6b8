/**
 * The vehicle as the installer edits it on the vehicle screen: changes apply to a draft at once
 * (so the fields show what was typed and the schema's sentences beside them), and the draft is
 * saved into the scene a moment after the last change, only when the schema accepts it. A saved
 * vehicle that changes from outside (a tap that moved a cylinder, a reload) replaces a draft
 * with nothing unsaved.
 */
import { useCallback, useEffect, useLayoutEffect, useRef, useState } from 'react';
import type { Vehicle } from '@/shared/schemas/vehicle';
import { vehicleProblems } from './vehicle-part-edits';

export const VEHICLE_SAVE_AFTER_MS = 900;

export function useVehicleDraft(saved: Vehicle, onSave: (v: Vehicle) => void) {
  const [draft, setDraft] = useState(saved);
  const dirty = useRef(false);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const saveRef = useRef(onSave);
  useLayoutEffect(() => {
    saveRef.current = onSave;
  }, [onSave]);
  const draftRef = useRef(draft);

  useEffect(() => {
    if (dirty.current) return;
    draftRef.current = saved;
    setDraft(saved);
  }, [saved]);
  useEffect(
    () => () => {
      if (timer.current) clearTimeout(timer.current);
    },
    [],
  );

  const problems = vehicleProblems(draft);

  const change = useCallback((edit: (v: Vehicle) => Vehicle, now = false) => {
    const next = edit(draftRef.current);
    draftRef.current = next;
    dirty.current = true;
    setDraft(next);
    if (timer.current) clearTimeout(timer.current);
    const save = () => {
      timer.current = null;
      if (vehicleProblems(next).size > 0) return;
      dirty.current = false;
      saveRef.current(next);
    };
    if (now) save();
    else timer.current = setTimeout(save, VEHICLE_SAVE_AFTER_MS);
  }, []);

  return { draft, problems, change };
}
