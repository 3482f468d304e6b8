import '@testing-library/jest-dom';
import { screen } from '@testing-library/react';
import { ProjectWorkspace } from '@/components/plan/project-workspace';
import { catalogKeys, useCatalogQuery } from '@/hooks/use-catalog';
import { projectKeys, useProjectQuery } from '@/hooks/use-projects';
import { sessionKeys } from '@/hooks/use-session';
import { evaluateProject } from '@/shared/project-optics';
import type { ProjectDto, UserDto } from '@/shared/schemas';
import { formatCoveredShare } from '@/shared/zone-verdict';
import { DEMO_PROJECT } from '../../server/seeders/demo-project';
import { demoCatalogueDtos, demoPlacementDtos } from './fixtures';
import { makeTestQueryClient, renderWithQuery } from './render';

jest.mock('@/hooks/api', () => ({ api: {} }));
// The screen is rendered without a navigator: the tab title and links are not under test here.
jest.mock('@/components/ui/page-title', () => ({ PageTitle: () => null }));
jest.mock('@/components/ui/text-link', () => ({ TextLink: ({ label }: { label: string }) => label }));

const STAMP = '2026-01-01T00:00:00.000Z';

/** The seeded demo catalogue, which the seeded placements name by code. */
const catalogue = demoCatalogueDtos();

function demoProject(canEdit: boolean): ProjectDto {
  const placements = demoPlacementDtos(7);
  return {
    id: 7,
    name: DEMO_PROJECT.name,
    customer: DEMO_PROJECT.customer,
    site: DEMO_PROJECT.site,
    kind: 'site',
    state: 'drawing_up',
    reviewerId: null,
    reviewerName: null,
    sentAt: null,
    approval: null,
    openCommentCount: 0,
    ownerId: 1,
    ownerName: 'Ines Installer',
    placementCount: placements.length,
    version: 1,
    createdAt: STAMP,
    updatedAt: STAMP,
    units: null,
    notes: '',
    scene: DEMO_PROJECT.scene,
    placements,
    canEdit,
  };
}

const user: UserDto = {
  id: 1,
  email: 'ines@sightfan-demo.example',
  name: 'Ines Installer',
  role: 'installer',
  disabled: false,
  units: 'metric',
  organizationId: 1,
  organizationName: 'Demo (demo)',
  hasPassword: true,
  createdAt: STAMP,
  updatedAt: STAMP,
};

function Screen({ id }: { id: number }) {
  return <ProjectWorkspace projectId={id} project={useProjectQuery(id)} catalogue={useCatalogQuery()} />;
}

function renderProject(project: ProjectDto) {
  const client = makeTestQueryClient();
  client.setQueryData(sessionKeys.me(), user);
  client.setQueryData(projectKeys.detail(project.id), project);
  client.setQueryData(catalogKeys.list(), catalogue);
  return renderWithQuery(<Screen id={project.id} />, client);
}

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
});
