import '@testing-library/jest-dom';
import { render, screen } from '@testing-library/react';
import { PlacementNumbersPanel, rimSqueezeText } from '@/components/placement/numbers-panel';
import { evaluateProject } from '@/shared/project-optics';
import type { PlacementDto } from '@/shared/schemas';
import { formatAngle, formatArea, formatLength, formatNumber, formatRange, type UnitSystem } from '@/shared/units';
import { formatCoveredShare } from '@/shared/zone-verdict';
import { TEST_AISLE_SCENE, TEST_CATALOGUE, testPlacement } from './fixtures';

// An invented aisle: a viewer 6 m from a 600 mm round mirror on a 0.8 m sphere, mounted at 2.6 m.
const catalogue = TEST_CATALOGUE;
const scene = TEST_AISLE_SCENE;
const placement: PlacementDto = testPlacement({ projectId: 1, version: 1 });

const project = evaluateProject({ scene, placements: [placement], catalogue });
const evaluation = project.placements[0];

describe('PlacementNumbersPanel', () => {
  it('has numbers to show for this test scene (else the other tests prove nothing)', () => {
    expect(evaluation.numbers).not.toBeNull();
    expect(evaluation.problem).toBeNull();
  });

  it.each<UnitSystem>(['metric', 'imperial'])("shows the engine's values in %s", (units) => {
    render(<PlacementNumbersPanel evaluation={evaluation} zones={project.zones} scene={scene} units={units} />);
    const n = evaluation.numbers!;
    const size = (m: number) => formatLength(m, units, { kind: 'size' });
    const dist = (m: number) => formatLength(m, units, { kind: 'distance' });

    expect(screen.getByTestId('numbers-focal-length')).toHaveTextContent(size(n.focalLengthM));
    expect(screen.getByTestId('numbers-radius')).toHaveTextContent(size(n.radiusM));
    expect(screen.getByTestId('numbers-eye-distance')).toHaveTextContent(dist(n.eyeDistanceM));
    expect(screen.getByTestId('numbers-field-of-view')).toHaveTextContent(
      `${formatAngle(n.onAxisFieldOfView.horizontalRad)} × ${formatAngle(n.onAxisFieldOfView.verticalRad)}`,
    );
    expect(screen.getByTestId('numbers-range-adult-detect')).toHaveTextContent(formatRange(n.rangesM.detect.adult, units));
    expect(screen.getByTestId('numbers-range-adult-recognise')).toHaveTextContent(formatRange(n.rangesM.recognise.adult, units));
    expect(screen.getByTestId('numbers-range-child-detect')).toHaveTextContent(formatRange(n.rangesM.detect.child, units));
    expect(screen.getByTestId('numbers-range-child-recognise')).toHaveTextContent(formatRange(n.rangesM.recognise.child, units));
    expect(screen.getByTestId('numbers-eye-off-axis')).toHaveTextContent(formatAngle(n.eyeOffAxisRad));
    expect(screen.getByTestId('numbers-floor-spread')).toHaveTextContent(formatAngle(n.floorSeen!.spreadRad));
    expect(screen.getByTestId('numbers-area')).toHaveTextContent(formatArea(evaluation.coverage!.areaM2, units));
    expect(screen.getByTestId('numbers-rim-squeeze')).toHaveTextContent(rimSqueezeText(n.rimSqueeze));
    for (const r of n.references) {
      const text = screen.getByTestId(`numbers-reference-${r.objectDistanceM}-text`);
      expect(text).toHaveTextContent(`×${formatNumber(r.magnification, 3)}`);
      expect(text).toHaveTextContent(`true distance ${dist(r.trueDistanceM)}`);
      expect(text).toHaveTextContent(`looks like ${dist(r.sizeCueDistanceM)}`);
    }
    const zone = project.zones[0];
    expect(screen.getByTestId('numbers-zone-z1')).toHaveTextContent(
      `${formatCoveredShare(zone.fraction)} (${formatArea(zone.coveredM2, units)})`,
    );
  });

  it('labels the field of view "on axis" and states the angles behind both ranges', () => {
    render(<PlacementNumbersPanel evaluation={evaluation} zones={project.zones} scene={scene} units="metric" />);
    expect(screen.getByText(/Field of view on axis/)).toBeInTheDocument();
    expect(screen.getByTestId('numbers-criteria-basis')).toHaveTextContent('at least 6′');
    expect(screen.getByTestId('numbers-criteria-basis')).toHaveTextContent('at least 20′');
    // The zone's row says which criterion it is scored by (a zone saved without one means recognise).
    expect(screen.getByText('Crossing, standing adult, recognise')).toBeInTheDocument();
  });

  it('writes imperial lengths in feet and inches, not metres', () => {
    render(<PlacementNumbersPanel evaluation={evaluation} zones={project.zones} scene={scene} units="imperial" />);
    expect(screen.getByTestId('numbers-range-adult-recognise').textContent).toMatch(/ft/);
    expect(screen.getByTestId('numbers-focal-length').textContent).toMatch(/in$/);
    expect(screen.getByTestId('numbers-panel').textContent).not.toMatch(/\d m\b/);
  });

  it("shows the engine's problem as a sentence instead of numbers", () => {
    const noViewer = evaluateProject({ scene, placements: [{ ...placement, viewerId: null }], catalogue });
    render(<PlacementNumbersPanel evaluation={noViewer.placements[0]} zones={noViewer.zones} scene={scene} units="metric" />);
    expect(screen.getByTestId('numbers-problem')).toHaveTextContent(noViewer.placements[0].problem!.message);
    expect(screen.queryByTestId('numbers-focal-length')).toBeNull();
  });
});
