/** The plan's tool state (usePlanTool): what it keeps between taps and what it sends. */
import { act, renderHook, waitFor } from '@testing-library/react';
import { usePlanTool, type PlanToolDeps } from '@/components/plan/use-plan-tool';
import { TAP_SENTENCES } from '@/components/plan/plan-tool-taps';
import type { PlacementDto, Scene } from '@/shared/schemas';
import { TEST_CATALOGUE, testPlacement } from './fixtures';

const empty: Scene = { walls: [], zones: [], viewers: [] };

function setup(over: Partial<PlanToolDeps> = {}) {
  const deps: PlanToolDeps = {
    baseScene: empty,
    mirrorCount: 0,
    catalogue: TEST_CATALOGUE,
    saveScene: jest.fn().mockResolvedValue(true),
    createPlacement: jest.fn(),
    select: jest.fn(),
    onMirrorPlaced: jest.fn(),
    ...over,
  };
  return { deps, ...renderHook(() => usePlanTool(deps)) };
}

describe('the plan’s tool state', () => {
  it('drops the sketch and the tool’s sentence when another tool is chosen', () => {
    const { result } = setup();
    act(() => result.current.setTool('wall'));
    act(() => result.current.tap([0, 0]));
    act(() => result.current.tap([0, 0.01]));
    expect(result.current.problem).toBe(TAP_SENTENCES.wallTooShort);
    act(() => result.current.tap([1, 1]));
    expect(result.current.sketch).toEqual([[1, 1]]);

    act(() => result.current.setTool('zone'));
    expect(result.current.sketch).toEqual([]);
    expect(result.current.problem).toBeNull();
  });

  it('saves a named zone once, selects it and goes back to Select', () => {
    const { result, deps } = setup();
    act(() => result.current.setTool('zone'));
    for (const p of [
      [0, 0],
      [6, 0],
      [6, 4],
    ] as const)
      act(() => result.current.tap([p[0], p[1]]));
    act(() => result.current.finishZone());
    expect(result.current.zoneToName).toHaveLength(3);
    expect(deps.saveScene).not.toHaveBeenCalled();

    act(() => result.current.nameZone('Loading bay', 'child'));
    expect(deps.saveScene).toHaveBeenCalledTimes(1);
    const saved = jest.mocked(deps.saveScene).mock.calls[0][0];
    expect(saved.zones).toEqual([expect.objectContaining({ name: 'Loading bay', target: { kind: 'child' } })]);
    expect(deps.select).toHaveBeenCalledWith({ kind: 'zone', id: saved.zones[0].id });
    expect(result.current.tool).toBe('select');
    expect(result.current.zoneToName).toBeNull();
    expect(result.current.sketch).toEqual([]);
  });

  it('selects a placed mirror and goes back to Select only once the server has created it', async () => {
    let resolve: (p: PlacementDto) => void = () => undefined;
    const created = new Promise<PlacementDto>((r) => (resolve = r));
    const { result, deps } = setup({ createPlacement: jest.fn(() => created) });
    act(() => result.current.setTool('mirror'));
    act(() => result.current.tap([3, 3]));
    expect(result.current.tool).toBe('mirror');
    expect(deps.select).not.toHaveBeenCalled();

    const placement = testPlacement();
    await act(async () => resolve(placement));
    await waitFor(() => expect(result.current.tool).toBe('select'));
    expect(deps.select).toHaveBeenCalledWith({ kind: 'placement', id: placement.id });
    expect(deps.onMirrorPlaced).toHaveBeenCalledWith(placement);
  });

  it('stays on Mirror and selects nothing when the mirror could not be created', async () => {
    const { result, deps } = setup({ createPlacement: jest.fn().mockResolvedValue(null) });
    act(() => result.current.setTool('mirror'));
    await act(async () => result.current.tap([3, 3]));
    expect(result.current.tool).toBe('mirror');
    expect(deps.select).not.toHaveBeenCalled();
  });
});
