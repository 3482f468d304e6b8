import '@testing-library/jest-dom';
import { fireEvent, screen } from '@testing-library/react';
import { evaluateProject, ProjectEvaluator } from '@/shared/project-optics';
import type { ProjectDto } from '@/shared/schemas';
import { formatCoveredShare } from '@/shared/zone-verdict';
import { DEMO_PROJECT } from '../../server/seeders/demo-project';
import { demoCatalogueDtos, demoPlacementDtos, testProject } from './fixtures';
import { renderProjectScreen } from './project-screen';

// A save never answers here: the tests look at what the screen shows before anything is saved.
jest.mock('@/hooks/api', () => ({ api: { projects: { updatePlacement: jest.fn(() => new Promise(() => undefined)) } } }));
// The screen is rendered without a navigator: the tab title and links are not under test here.
jest.mock('@/components/ui/page-title', () => ({ PageTitle: () => null }));
jest.mock('@/components/ui/text-link', () => ({ TextLink: ({ label }: { label: string }) => label }));

/** The seeded demo catalogue, which the seeded placements name by code. */
const catalogue = demoCatalogueDtos();

function demoProject(canEdit: boolean): ProjectDto {
  return testProject({
    id: 7,
    name: DEMO_PROJECT.name,
    customer: DEMO_PROJECT.customer,
    site: DEMO_PROJECT.site,
    scene: DEMO_PROJECT.scene,
    placements: demoPlacementDtos(7),
    canEdit,
  });
}

const renderProject = (project: ProjectDto) => renderProjectScreen(project, catalogue);

describe('the project plan', () => {
  it('labels each zone with the covered percentage that evaluateProject computes', () => {
    const project = demoProject(true);
    const expected = evaluateProject({ scene: project.scene, placements: project.placements, catalogue });
    renderProject(project);
    for (const zone of project.scene.zones) {
      const fraction = expected.zones.find((z) => z.zoneId === zone.id)!.fraction;
      expect(screen.getByTestId(`zone-pct-${zone.id}`)).toHaveTextContent(formatCoveredShare(fraction));
      expect(screen.getByTestId(`zone-label-${zone.id}`)).toHaveTextContent(`${zone.name} · ${formatCoveredShare(fraction)}`);
    }
  });

  it('draws every placement marker and coverage fan, and the project title', () => {
    const project = demoProject(true);
    renderProject(project);
    expect(screen.getByTestId('project-title')).toHaveTextContent(project.name);
    for (const p of project.placements) {
      expect(screen.getByTestId(`placement-marker-${p.id}`)).toBeInTheDocument();
      expect(screen.getByTestId(`placement-fan-${p.id}`).getAttribute('d')).toMatch(/^M/);
    }
  });

  it('offers the drawing tools to the owner', () => {
    renderProject(demoProject(true));
    for (const tool of ['select', 'mirror', 'viewer', 'zone', 'wall']) expect(screen.getByTestId(`plan-tool-${tool}`)).toBeInTheDocument();
  });

  it('shows a read-only project without drawing tools, with the reviewing note', () => {
    renderProject(demoProject(false));
    expect(screen.getByTestId('plan-read-only')).toHaveTextContent('Read only — you are reviewing');
    for (const tool of ['mirror', 'viewer', 'zone', 'wall']) expect(screen.queryByTestId(`plan-tool-${tool}`)).toBeNull();
    expect(screen.queryByTestId('plan-delete')).toBeNull();
    expect(screen.queryByTestId('aim-handle')).toBeNull();
  });

  it('feeds the editor the plan’s live mirror and evaluation: a typed height changes the plan’s zone figures at once, through one evaluator', () => {
    const project = demoProject(true);
    const mirror = project.placements[0];
    const heightM = 4.5;
    const before = evaluateProject({ scene: project.scene, placements: project.placements, catalogue });
    const after = evaluateProject({
      scene: project.scene,
      placements: project.placements.map((p) => (p.id === mirror.id ? { ...p, heightM } : p)),
      catalogue,
    });
    const figure = (ev: typeof before, zoneId: string) => formatCoveredShare(ev.zones.find((z) => z.zoneId === zoneId)!.fraction);
    // The check means something only if the new height changes a figure the plan shows.
    expect(project.scene.zones.some((z) => figure(before, z.id) !== figure(after, z.id))).toBe(true);

    const evaluators = new Set<ProjectEvaluator>();
    const evaluate = ProjectEvaluator.prototype.evaluate;
    const spy = jest.spyOn(ProjectEvaluator.prototype, 'evaluate').mockImplementation(function (this: ProjectEvaluator, ...args) {
      evaluators.add(this);
      return evaluate.apply(this, args);
    });
    try {
      renderProject(project);
      // The test window is phone-sized: the details are in the bottom drawer.
      fireEvent.click(screen.getByTestId('drawer-toggle'));
      fireEvent.click(screen.getByTestId(`summary-placement-${mirror.id}`));
      fireEvent.change(screen.getByTestId('placement-height'), { target: { value: `${heightM} m` } });

      for (const zone of project.scene.zones) expect(screen.getByTestId(`zone-pct-${zone.id}`)).toHaveTextContent(figure(after, zone.id));
      expect(evaluators.size).toBe(1);
    } finally {
      spy.mockRestore();
    }
  });
});
