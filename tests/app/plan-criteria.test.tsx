import '@testing-library/jest-dom';
import { fireEvent, screen } from '@testing-library/react';
import { PlanDetails, type PlanDetailsProps } from '@/components/plan/plan-details';
import { usePlacementWrites } from '@/hooks/use-placement-writes';
import type { Scene } from '@/shared/schemas';
import { testProject } from './fixtures';
import { renderWithQuery } from './render';

jest.mock('@/hooks/api', () => ({ api: {} }));

const ARCMIN = Math.PI / 10800;
const scene: Scene = {
  walls: [],
  zones: [
    {
      id: 'z1',
      name: 'Crossing',
      polygonM: [
        [0, 1],
        [5, 1],
        [5, 4],
        [0, 4],
      ],
      target: { kind: 'adult' },
    },
    {
      id: 'z2',
      name: 'Gate',
      polygonM: [
        [0, 5],
        [5, 5],
        [5, 8],
        [0, 8],
      ],
      target: { kind: 'child' },
      criterion: 'detect',
    },
  ],
  viewers: [],
};
const project = testProject({ id: 7, name: 'Aisle (demo)', scene });

/** The details with the real placement write path (the one the plan passes down). */
function Details(props: Omit<PlanDetailsProps, 'writes'>) {
  const writes = usePlacementWrites(props.project);
  return <PlanDetails {...props} writes={writes} />;
}

function renderDetails(overrides: Partial<Omit<PlanDetailsProps, 'writes'>>) {
  const props: Omit<PlanDetailsProps, 'writes'> = {
    project,
    scene,
    placements: [],
    evaluation: null,
    catalogue: [],
    units: 'metric',
    canEdit: true,
    selection: null,
    onSelect: jest.fn(),
    onViewerEyeHeight: jest.fn(),
    onZoneCriterion: jest.fn(),
    onCriteria: jest.fn(),
    ...overrides,
  };
  renderWithQuery(<Details {...props} />);
  return props;
}

describe('criteria on the plan', () => {
  it('says which criterion a zone asks for, with its angle, and a zone saved without one asks to recognise', () => {
    renderDetails({ selection: { kind: 'zone', id: 'z1' } });
    expect(screen.getByTestId('zone-criterion-text')).toHaveTextContent("so that they are recognised: 20′ of the person's height");
  });

  it('lets the owner switch a zone to detect', () => {
    const props = renderDetails({ selection: { kind: 'zone', id: 'z1' } });
    fireEvent.click(screen.getByTestId('zone-criterion-detect'));
    expect(props.onZoneCriterion).toHaveBeenCalledWith('z1', 'detect');
  });

  it('uses the project’s own angle when it has one', () => {
    renderDetails({
      selection: { kind: 'zone', id: 'z2' },
      scene: { ...scene, criteria: { detectRad: 4 * ARCMIN, recogniseRad: 30 * ARCMIN } },
    });
    expect(screen.getByTestId('zone-criterion-text')).toHaveTextContent("child so that they are detected: 4′ of the person's height");
  });

  it('lists each zone with its target and criterion, and the project’s angles, in the summary', () => {
    renderDetails({});
    expect(screen.getByText('Target: standing adult, recognise')).toBeInTheDocument();
    expect(screen.getByText('Target: child, detect')).toBeInTheDocument();
    expect(screen.getByTestId('criteria-sentence')).toHaveTextContent('at least 6′');
  });
});
