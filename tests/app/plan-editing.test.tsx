/** Editing what was drawn and undoing it: the handles' gesture, the item editor, the history hook and the keys. */
import '@testing-library/jest-dom';
import { act, fireEvent, render, renderHook, screen } from '@testing-library/react';
import { aimOutcomeText } from '@/components/plan/aim-at-zone-action';
import { endGesture, moveGesture, startGesture, type GestureContext } from '@/components/plan/plan-gesture';
import { SceneItemEditor } from '@/components/plan/scene-item-editor';
import { toScreen, type PlanView } from '@/components/plan/plan-view';
import { undoKeyAction, useUndoKeys } from '@/components/plan/undo-controls';
import { usePlanHistory, type PlanHistoryDeps } from '@/hooks/use-plan-history';
import type { PlacementDto, Scene } from '@/shared/schemas';
import { testPlacement } from './fixtures';

const view: PlanView = { scale: 20, offsetX: 100, offsetY: 500 };
const scene: Scene = {
  walls: [{ id: 'w1', kind: 'wall', aM: [0, 0], bM: [5, 0], heightM: 2.5 }],
  zones: [
    {
      id: 'z1',
      name: 'Zone 1',
      polygonM: [
        [1, 1],
        [4, 1],
        [4, 4],
      ],
      target: { kind: 'adult' },
    },
  ],
  viewers: [{ id: 'v1', name: 'Driver', positionM: [-3, 0], eyeHeightM: 2.1 }],
};
const ctx = (over: Partial<GestureContext> = {}): GestureContext => ({
  view,
  scene,
  placements: [],
  selection: { kind: 'zone', id: 'z1' },
  canEdit: true,
  tool: 'select',
  ...over,
});

describe('reshaping on the plan', () => {
  it('dragging the selected zone’s corner square moves that corner, and the release hands over the reshaped scene', () => {
    const c = ctx();
    const start = startGesture(c, [toScreen(view, [4, 4])]);
    expect(start.gesture?.mode).toBe('handle');
    const moved = moveGesture(c, start.gesture!, [toScreen(view, [5, 6])]);
    expect(moved.effects).toHaveLength(1);
    const end = endGesture(c, moved.gesture!, toScreen(view, [5, 6]));
    expect(end).toEqual([
      {
        kind: 'drag',
        drag: {
          kind: 'scene-handle',
          done: true,
          scene: {
            ...scene,
            zones: [
              {
                ...scene.zones[0],
                polygonM: [
                  [1, 1],
                  [4, 1],
                  [5, 6],
                ],
              },
            ],
          },
        },
      },
    ]);
  });

  it('drags a wall’s end only when the wall is selected, and never for someone who may not edit', () => {
    const at = toScreen(view, [5, 0]);
    expect(startGesture(ctx({ selection: { kind: 'wall', id: 'w1' } }), [at]).gesture?.mode).toBe('handle');
    expect(startGesture(ctx({ selection: null }), [at]).gesture?.mode).not.toBe('handle');
    expect(startGesture(ctx({ selection: { kind: 'wall', id: 'w1' }, canEdit: false }), [at]).gesture?.mode).not.toBe('handle');
  });
});

describe('the item editor', () => {
  it('renames the selected zone through a scene edit', () => {
    const onEdit = jest.fn(() => null);
    render(<SceneItemEditor scene={scene} selection={{ kind: 'zone', id: 'z1' }} units="metric" onEdit={onEdit} />);
    fireEvent.change(screen.getByTestId('zone-name'), { target: { value: 'Dock door' } });
    fireEvent.click(screen.getByTestId('zone-rename'));
    return screen.findByTestId('zone-name').then(() => {
      expect(onEdit).toHaveBeenCalledWith({ ...scene, zones: [{ ...scene.zones[0], name: 'Dock door' }] });
    });
  });

  it('offers no corner removal on a three-cornered zone, and adds a corner in the middle of the edge after the chosen corner', () => {
    const onEdit = jest.fn(() => null);
    render(<SceneItemEditor scene={scene} selection={{ kind: 'zone', id: 'z1' }} units="metric" onEdit={onEdit} />);
    expect(screen.getByTestId('zone-corner-remove-0')).toHaveAttribute('aria-disabled', 'true');
    fireEvent.click(screen.getByTestId('zone-corner-add-1'));
    expect(onEdit).toHaveBeenCalledWith({
      ...scene,
      zones: [
        {
          ...scene.zones[0],
          polygonM: [
            [1, 1],
            [4, 1],
            [4, 2.5],
            [4, 4],
          ],
        },
      ],
    });
  });

  it('changes a wall into racking', () => {
    const onEdit = jest.fn(() => null);
    render(<SceneItemEditor scene={scene} selection={{ kind: 'wall', id: 'w1' }} units="metric" onEdit={onEdit} />);
    fireEvent.click(screen.getByTestId('wall-kind-racking'));
    expect(onEdit).toHaveBeenCalledWith({ ...scene, walls: [{ ...scene.walls[0], kind: 'racking' }] });
  });
});

describe('undo through the write paths', () => {
  function deps(over: Partial<PlanHistoryDeps> = {}): PlanHistoryDeps {
    return {
      baseScene: scene,
      placements: [testPlacement()],
      saveScene: jest.fn(async () => true),
      savePlacement: jest.fn(),
      changePlacement: jest.fn(),
      removePlacement: jest.fn(async () => undefined),
      createPlacement: jest.fn(async (body) => ({ ...testPlacement(), ...body, id: 99 }) as PlacementDto),
      deletePlacement: jest.fn(async () => true),
      ...over,
    };
  }

  it('brings a deleted mirror back with identical values through createPlacement', async () => {
    const d = deps();
    const { result } = renderHook(() => usePlanHistory(d));
    await act(() => result.current.deletePlacement(7));
    expect(result.current.canUndo).toBe(true);
    await act(async () => result.current.undo());
    const { id: _id, version: _v, updatedAt: _u, projectId: _p, ...values } = testPlacement();
    expect(d.createPlacement).toHaveBeenCalledWith({ ...values, mirrorClass: null, servesFieldIds: null });
    expect(result.current.canRedo).toBe(true);
  });

  it('undoes a run of typing in the mirror editor as one step, back to the value from before the run', async () => {
    const d = deps();
    const before = testPlacement().heightM;
    const { result } = renderHook(() => usePlanHistory(d));
    // "3", "3.", "3.4": three keystrokes on the height, each a change the editor autosaves.
    for (const h of [3, 3, 3.4]) act(() => result.current.typePlacement(7, { heightM: h }, 900));
    expect(d.changePlacement).toHaveBeenLastCalledWith(7, { heightM: 3.4 }, 900);
    await act(async () => result.current.undo());
    expect(d.savePlacement).toHaveBeenCalledTimes(1);
    expect(d.savePlacement).toHaveBeenCalledWith(7, { heightM: before });
    expect(result.current.canUndo).toBe(false);
    await act(async () => result.current.redo());
    expect(d.savePlacement).toHaveBeenLastCalledWith(7, { heightM: 3.4 });
  });

  it('records the editor’s confirmed remove once the server has removed the mirror, so undo brings it back', async () => {
    const d = deps();
    const { result } = renderHook(() => usePlanHistory(d));
    await act(() => result.current.removeFromEditor(7));
    expect(d.removePlacement).toHaveBeenCalledWith(7);
    await act(async () => result.current.undo());
    expect(d.createPlacement).toHaveBeenCalledTimes(1);
  });

  it('records nothing when the editor’s remove is refused, and passes the refusal on for the editor to show', async () => {
    const d = deps({ removePlacement: jest.fn(async () => Promise.reject(new Error('Refused.'))) });
    const { result } = renderHook(() => usePlanHistory(d));
    await expect(act(() => result.current.removeFromEditor(7))).rejects.toThrow('Refused.');
    expect(result.current.canUndo).toBe(false);
  });

  it('keeps a scene step to undo again when its save is refused (the save shows its own conflict notice)', async () => {
    const next = { ...scene, viewers: [] };
    const saveScene = jest.fn(async () => true);
    const d = deps({ saveScene });
    const { result, rerender } = renderHook((p: PlanHistoryDeps) => usePlanHistory(p), { initialProps: d });
    await act(() => result.current.saveScene(next));
    rerender({ ...d, baseScene: next, saveScene: jest.fn(async () => false) });
    await act(async () => result.current.undo());
    expect(result.current.canUndo).toBe(true);
    expect(result.current.canRedo).toBe(false);
  });

  it('refuses to undo over a plan changed elsewhere, and says so', async () => {
    const d = deps();
    const { result, rerender } = renderHook((p: PlanHistoryDeps) => usePlanHistory(p), { initialProps: d });
    await act(() => result.current.saveScene({ ...scene, viewers: [] }));
    rerender({ ...d, baseScene: { ...scene, walls: [] } });
    await act(async () => result.current.undo());
    expect(result.current.problem).toMatch(/changed elsewhere/);
    expect(result.current.canUndo).toBe(false);
  });
});

describe('keys and words', () => {
  it.each([
    [{ key: 'z', ctrlKey: true, metaKey: false, shiftKey: false, altKey: false }, 'undo'],
    [{ key: 'z', ctrlKey: false, metaKey: true, shiftKey: false, altKey: false }, 'undo'],
    [{ key: 'Z', ctrlKey: true, metaKey: false, shiftKey: true, altKey: false }, 'redo'],
    [{ key: 'y', ctrlKey: true, metaKey: false, shiftKey: false, altKey: false }, 'redo'],
    [{ key: 'z', ctrlKey: false, metaKey: false, shiftKey: false, altKey: false }, null],
    [{ key: 'z', ctrlKey: true, metaKey: false, shiftKey: false, altKey: true }, null],
  ])('reads %o as %s', (e, action) => {
    expect(undoKeyAction(e)).toBe(action);
  });

  it('undoes on Ctrl+Z on the wide screen, but leaves Ctrl+Z inside a text field to the field', () => {
    const undo = jest.fn();
    const redo = jest.fn();
    renderHook(() => useUndoKeys(true, undo, redo));
    fireEvent.keyDown(window, { key: 'z', ctrlKey: true });
    fireEvent.keyDown(window, { key: 'y', ctrlKey: true });
    expect(undo).toHaveBeenCalledTimes(1);
    expect(redo).toHaveBeenCalledTimes(1);
    const input = document.createElement('input');
    document.body.appendChild(input);
    fireEvent.keyDown(input, { key: 'z', ctrlKey: true });
    expect(undo).toHaveBeenCalledTimes(1);
    input.remove();
  });

  it('states the share before and after with the plan’s one rounding rule, and says when nothing better was found', () => {
    expect(aimOutcomeText('Bay', { aim: { azimuthRad: 0, tiltDownRad: 0 }, shareBefore: 0.12, shareAfter: 0.58 })).toBe(
      'Bay: 12 % → 58 % seen. Undo turns the mirror back.',
    );
    expect(aimOutcomeText('Bay', { aim: { azimuthRad: 0, tiltDownRad: 0 }, shareBefore: 0.5, shareAfter: 0.5 })).toMatch(
      /^No aim shows more of Bay/,
    );
  });
});
