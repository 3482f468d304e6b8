/**
 * The plan's undo history (components/plan/plan-history.ts), without a renderer. The steps run
 * against a small in-memory stand-in for the API: it stores the scene and the mirrors and, like the
 * server, gives every added mirror a new id, so a removed mirror comes back under another id.
 */
import * as fc from 'fast-check';
import {
  emptyHistory,
  fieldsBefore,
  HISTORY_LIMIT,
  placementBody,
  recordStep,
  recordTyping,
  renumberPlacement,
  TYPING_RUN_MS,
  takeRedo,
  takeUndo,
  type PlanHistory,
  type PlanStep,
} from '@/components/plan/plan-history';
import type { PlacementEdits } from '@/hooks/use-placement-writes';
import type { CreatePlacementBody, PlacementDto, Scene } from '@/shared/schemas';
import { anyPointM, anyScene } from './scene-arbitrary';

interface Store {
  scene: Scene;
  placements: PlacementDto[];
  nextId: number;
}

function add(store: Store, body: CreatePlacementBody): PlacementDto {
  const p: PlacementDto = {
    id: store.nextId++,
    projectId: 1,
    label: body.label,
    catalogueItemId: body.catalogueItemId ?? null,
    customMirror: body.customMirror ?? null,
    positionM: body.positionM,
    heightM: body.heightM,
    azimuthRad: body.azimuthRad,
    tiltDownRad: body.tiltDownRad,
    viewerId: body.viewerId ?? null,
    notes: body.notes ?? '',
    mirrorClass: body.mirrorClass ?? null,
    servesFieldIds: body.servesFieldIds ?? null,
    version: 1,
    updatedAt: '2026-01-01T00:00:00.000Z',
  };
  store.placements = [...store.placements, p];
  return p;
}

/** Runs a step as the hook does (through the stand-in API); returns the id a re-added mirror got. */
function run(store: Store, step: PlanStep): number | undefined {
  switch (step.kind) {
    case 'scene':
      store.scene = step.after;
      return undefined;
    case 'placement-change':
      store.placements = store.placements.map((p) => (p.id === step.id ? { ...p, ...step.after, version: p.version + 1 } : p));
      return undefined;
    case 'placement-remove':
      store.placements = store.placements.filter((p) => p.id !== step.id);
      return undefined;
    case 'placement-add':
      return add(store, step.body).id;
  }
}

function undoOnce(store: Store, h: PlanHistory): PlanHistory {
  const u = takeUndo(h);
  if (!u) return h;
  const newId = run(store, u.run);
  return newId !== undefined && u.run.kind !== 'scene' ? renumberPlacement(u.history, u.run.id, newId) : u.history;
}

function redoOnce(store: Store, h: PlanHistory): PlanHistory {
  const r = takeRedo(h);
  if (!r) return h;
  const newId = run(store, r.run);
  return newId !== undefined && r.run.kind !== 'scene' ? renumberPlacement(r.history, r.run.id, newId) : r.history;
}

/** A mirror's values without what the server assigns (id, version, date): "identical" in the brief's sense. */
const values = (ps: readonly PlacementDto[]) => ps.map(({ id: _id, version: _v, updatedAt: _u, ...rest }) => JSON.stringify(rest)).sort();

const anyBody: fc.Arbitrary<CreatePlacementBody> = fc.record({
  label: fc.string({ minLength: 1, maxLength: 20 }),
  catalogueItemId: fc.integer({ min: 1, max: 50 }),
  positionM: anyPointM,
  heightM: fc.double({ min: 0.2, max: 30, noNaN: true }),
  azimuthRad: fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
  tiltDownRad: fc.double({ min: 0, max: 1.5, noNaN: true }),
  viewerId: fc.constantFrom(null, 'v1'),
});

const anyPatch: fc.Arbitrary<PlacementEdits> = fc.record(
  {
    positionM: anyPointM,
    azimuthRad: fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
    tiltDownRad: fc.double({ min: 0, max: 1.5, noNaN: true }),
    label: fc.string({ minLength: 1, maxLength: 20 }),
  },
  { requiredKeys: [] },
);

/** One edit as a person makes it on the plan; which mirror is chosen by `pick` when it runs. */
const anyEdit = fc.oneof(
  anyScene(2).map((scene) => ({ kind: 'scene' as const, scene })),
  anyBody.map((body) => ({ kind: 'add' as const, body })),
  fc.tuple(fc.nat(), anyPatch).map(([pick, patch]) => ({ kind: 'change' as const, pick, patch })),
  fc.nat().map((pick) => ({ kind: 'remove' as const, pick })),
);
type Edit = typeof anyEdit extends fc.Arbitrary<infer T> ? T : never;

/** Does the edit against the store and records it as usePlanHistory does. */
function edit(store: Store, h: PlanHistory, e: Edit, limit = HISTORY_LIMIT): PlanHistory {
  if (e.kind === 'scene') {
    const before = store.scene;
    store.scene = e.scene;
    return recordStep(h, { kind: 'scene', before, after: e.scene }, limit);
  }
  if (e.kind === 'add' || store.placements.length === 0) {
    const created = add(
      store,
      e.kind === 'add' ? e.body : { label: 'M', catalogueItemId: 1, positionM: [0, 0], heightM: 3, azimuthRad: 0, tiltDownRad: 0.26 },
    );
    return recordStep(h, { kind: 'placement-add', id: created.id, body: placementBody(created) }, limit);
  }
  const p = store.placements[e.pick % store.placements.length];
  if (e.kind === 'change') {
    const step: PlanStep = { kind: 'placement-change', id: p.id, before: fieldsBefore(p, e.patch), after: e.patch };
    run(store, step);
    return recordStep(h, step, limit);
  }
  run(store, { kind: 'placement-remove', id: p.id, body: placementBody(p) });
  return recordStep(h, { kind: 'placement-remove', id: p.id, body: placementBody(p) }, limit);
}

const start = fc.tuple(anyScene(2), fc.array(anyBody, { maxLength: 3 })).map(([scene, bodies]) => {
  const store: Store = { scene, placements: [], nextId: 1 };
  for (const b of bodies) add(store, b);
  return store;
});

describe('the plan’s undo history', () => {
  it('gives back the original scene and mirrors after any sequence of edits followed by as many undos', () => {
    fc.assert(
      fc.property(start, fc.array(anyEdit, { maxLength: 25 }), (store, edits) => {
        const scene0 = store.scene;
        const mirrors0 = values(store.placements);
        let h = emptyHistory;
        for (const e of edits) h = edit(store, h, e);
        for (let i = 0; i < edits.length; i++) h = undoOnce(store, h);
        expect(store.scene).toEqual(scene0);
        expect(values(store.placements)).toEqual(mirrors0);
        expect(takeUndo(h)).toBeNull();
      }),
    );
  });

  it('redoing every undone step gives back the edited scene and mirrors', () => {
    fc.assert(
      fc.property(start, fc.array(anyEdit, { maxLength: 25 }), fc.nat(25), (store, edits, undos) => {
        let h = emptyHistory;
        for (const e of edits) h = edit(store, h, e);
        const scene1 = store.scene;
        const mirrors1 = values(store.placements);
        const n = Math.min(undos, edits.length);
        for (let i = 0; i < n; i++) h = undoOnce(store, h);
        for (let i = 0; i < n; i++) h = redoOnce(store, h);
        expect(store.scene).toEqual(scene1);
        expect(values(store.placements)).toEqual(mirrors1);
        expect(takeRedo(h)).toBeNull();
      }),
    );
  });

  it('a new edit after an undo drops the steps that could have been redone', () => {
    const scenes = [0, 1, 2].map((i): Scene => ({
      walls: [],
      zones: [],
      viewers: [{ id: 'v', name: `V${i}`, positionM: [i, 0], eyeHeightM: 1.6 }],
    }));
    let h = recordStep(emptyHistory, { kind: 'scene', before: scenes[0], after: scenes[1] });
    h = takeUndo(h)!.history;
    expect(h.future).toHaveLength(1);
    h = recordStep(h, { kind: 'scene', before: scenes[0], after: scenes[2] });
    expect(takeRedo(h)).toBeNull();
  });

  it('keeps the last 100 steps of a longer session (the bound), so the 101st undo does nothing', () => {
    const store: Store = { scene: { walls: [], zones: [], viewers: [] }, placements: [], nextId: 1 };
    let h = emptyHistory;
    const scenes: Scene[] = [];
    for (let i = 0; i < HISTORY_LIMIT + 20; i++) {
      scenes.push(store.scene);
      h = edit(store, h, {
        kind: 'scene',
        scene: { walls: [], zones: [], viewers: [{ id: 'v', name: `V${i}`, positionM: [i, 0], eyeHeightM: 1.6 }] },
      });
    }
    expect(h.past).toHaveLength(HISTORY_LIMIT);
    for (let i = 0; i < HISTORY_LIMIT + 5; i++) h = undoOnce(store, h);
    expect(store.scene).toEqual(scenes[20]);
  });

  it('brings a removed mirror back with identical values and lets a later undo of its move find it under the new id', () => {
    const store: Store = { scene: { walls: [], zones: [], viewers: [] }, placements: [], nextId: 1 };
    let h = edit(store, emptyHistory, {
      kind: 'add',
      body: { label: 'M1', catalogueItemId: 3, positionM: [1, 2], heightM: 3, azimuthRad: 0.5, tiltDownRad: 0.26 },
    });
    h = edit(store, h, { kind: 'change', pick: 0, patch: { positionM: [4, 4] } });
    const moved = values(store.placements);
    h = edit(store, h, { kind: 'remove', pick: 0 });
    h = undoOnce(store, h);
    expect(values(store.placements)).toEqual(moved);
    expect(store.placements[0].id).not.toBe(1);
    h = undoOnce(store, h);
    expect(store.placements[0].positionM).toEqual([1, 2]);
    h = undoOnce(store, h);
    expect(store.placements).toEqual([]);
    expect(takeUndo(h)).toBeNull();
  });

  describe('typing in the mirror editor', () => {
    const at = (h: PlanHistory) => h.past[h.past.length - 1];

    it('folds keystrokes on one mirror within the run time into one step that keeps the value from before the run', () => {
      let h = recordTyping(emptyHistory, 7, { heightM: 2.5 }, { heightM: 3 }, 1000);
      h = recordTyping(h, 7, { heightM: 3 }, { heightM: 3.4 }, 1000 + TYPING_RUN_MS);
      h = recordTyping(h, 7, { tiltDownRad: 0.2 }, { tiltDownRad: 0.3 }, 1500 + TYPING_RUN_MS);
      expect(h.past).toHaveLength(1);
      expect(at(h)).toMatchObject({ before: { heightM: 2.5, tiltDownRad: 0.2 }, after: { heightM: 3.4, tiltDownRad: 0.3 } });
    });

    it('starts a new step after a pause longer than the run time, on another mirror, or after another edit', () => {
      let h = recordTyping(emptyHistory, 7, { heightM: 2.5 }, { heightM: 3 }, 0);
      h = recordTyping(h, 7, { heightM: 3 }, { heightM: 4 }, TYPING_RUN_MS + 1);
      expect(h.past).toHaveLength(2);
      h = recordTyping(h, 8, { heightM: 1 }, { heightM: 2 }, TYPING_RUN_MS + 2);
      expect(h.past).toHaveLength(3);
      h = recordStep(h, { kind: 'placement-change', id: 8, before: { heightM: 2 }, after: { heightM: 5 } });
      h = recordTyping(h, 8, { heightM: 5 }, { heightM: 6 }, TYPING_RUN_MS + 3);
      expect(h.past).toHaveLength(5);
    });

    it('does not fold new typing into a step that was undone and redone', () => {
      let h = recordTyping(emptyHistory, 7, { heightM: 2.5 }, { heightM: 3 }, 0);
      h = takeUndo(h)!.history;
      h = takeRedo(h)!.history;
      h = recordTyping(h, 7, { heightM: 3 }, { heightM: 3.5 }, 10);
      expect(h.past).toHaveLength(2);
    });
  });
});
