/**
 * The placement editor's draft: the server's placement with the person's unsaved edits on top.
 * Only edited fields are kept locally, so a change made elsewhere (the plan's drag handle moving
 * the mirror) shows here at once for every field the person has not touched. Edits are saved a
 * moment after typing stops; a 409 keeps the edits and shows what the server now holds.
 */
import { useCallback, useEffect, useRef, useState } from 'react';
import { useUpdatePlacementMutation } from '@/hooks/use-projects';
import { ApiError } from '@/shared/api-client';
import { describeError } from '@/shared/errors';
import type { PatchPlacementBody, PlacementDto, ProjectDto } from '@/shared/schemas';

export type EditableFields = Pick<PlacementDto, 'label' | 'catalogueItemId' | 'customMirror' | 'positionM' | 'heightM' | 'azimuthRad' | 'tiltDownRad' | 'viewerId' | 'notes'>;
export type PlacementEdits = Partial<EditableFields>;

/** Long enough to let a person finish typing "2 ft 3 in", short enough that leaving rarely loses a save. */
export const AUTOSAVE_MS = 900;

const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

function without(edits: PlacementEdits, isSettled: (key: keyof EditableFields) => boolean): PlacementEdits {
  const out: PlacementEdits = {};
  let changed = false;
  for (const key of Object.keys(edits) as (keyof EditableFields)[]) {
    if (isSettled(key)) changed = true;
    else Object.assign(out, { [key]: edits[key] });
  }
  return changed ? out : edits;
}

export interface Conflict {
  message: string;
  /** The server's values for the fields the person had edited. */
  theirs: PlacementEdits;
}

export function usePlacementDraft(project: ProjectDto, placementId: number, canEdit: boolean) {
  const server = project.placements.find((p) => p.id === placementId) ?? null;
  const mutation = useUpdatePlacementMutation(project.id);
  const [edits, setEdits] = useState<PlacementEdits>({});
  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [conflict, setConflict] = useState<Conflict | null>(null);
  // After a refused save, wait for the person to change something rather than retry in a loop.
  const [blocked, setBlocked] = useState(false);

  // Once the server holds what the person typed (saved here or elsewhere), the edit is no longer "unsaved".
  useEffect(() => {
    if (!server) return;
    setEdits((e) => without(e, (k) => same(e[k], server[k])));
  }, [server]);

  const dirty = Object.keys(edits).length > 0;
  const draft: PlacementDto | null = server ? { ...server, ...edits } : null;

  const change = useCallback((patch: PlacementEdits) => {
    setEdits((e) => ({ ...e, ...patch }));
    setBlocked(false);
    setFormError(null);
    setFieldErrors((fe) => {
      const keys = Object.keys(patch);
      const next = Object.fromEntries(Object.entries(fe).filter(([f]) => !keys.some((k) => f === k || f.startsWith(`${k}.`))));
      return Object.keys(next).length === Object.keys(fe).length ? fe : next;
    });
  }, []);

  const save = useCallback(
    (opts: { version?: number } = {}) => {
      if (!server || !canEdit || Object.keys(edits).length === 0) return;
      const sent = edits;
      const body: PatchPlacementBody = { ...sent, version: opts.version ?? server.version };
      mutation.mutate(
        { placementId, body },
        {
          onSuccess: () => {
            setConflict(null);
            setFormError(null);
            // Drop only what was sent and is unchanged since: later typing stays unsaved.
            setEdits((e) => without(e, (k) => k in sent && same(e[k], sent[k])));
          },
          onError: (err) => {
            setBlocked(true);
            if (err instanceof ApiError && err.status === 409) {
              const current = err.current as PlacementDto | undefined;
              const theirs: PlacementEdits = {};
              if (current) for (const k of Object.keys(sent) as (keyof EditableFields)[]) Object.assign(theirs, { [k]: current[k] });
              setConflict({ message: 'Someone changed this mirror while you were editing. Your values are still here, not saved; the saved ones are listed below.', theirs });
              return;
            }
            if (err instanceof ApiError) setFieldErrors(err.fields);
            setFormError(describeError(err));
          },
        },
      );
    },
    [server, canEdit, edits, mutation, placementId],
  );

  // Save a moment after the last change; never while a save is in flight or a conflict is open.
  useEffect(() => {
    if (!dirty || blocked || conflict || mutation.isPending || !canEdit) return;
    const t = setTimeout(() => save(), AUTOSAVE_MS);
    return () => clearTimeout(t);
  }, [dirty, blocked, conflict, mutation.isPending, canEdit, save]);

  // Leaving the editor with unsaved edits saves them rather than dropping what was typed.
  const flushRef = useRef<() => void>(() => undefined);
  flushRef.current = () => {
    if (dirty && !blocked && !conflict && !mutation.isPending) save();
  };
  useEffect(() => () => flushRef.current(), []);

  return {
    server,
    draft,
    edits,
    dirty,
    change,
    save,
    saving: mutation.isPending,
    fieldErrors,
    formError,
    conflict,
    /** Save the person's values over the server's (the server's version is now in the cache). */
    keepMine: () => {
      setConflict(null);
      setBlocked(false);
      save();
    },
    /** Drop the person's edits and show the saved values. */
    useTheirs: () => {
      setConflict(null);
      setBlocked(false);
      setEdits({});
    },
  };
}
