import '@testing-library/jest-dom';
import { screen } from '@testing-library/react';
import { ProjectWorkspace } from '@/components/plan/project-workspace';
import { catalogKeys, useCatalogQuery } from '@/hooks/use-catalog';
import { projectKeys, useProjectQuery } from '@/hooks/use-projects';
import { sessionKeys } from '@/hooks/use-session';
import { evaluateProject } from '@/shared/project-optics';
import type { CatalogueItemDto, PlacementDto, ProjectDto, UserDto } from '@/shared/schemas';
import { formatPercent } from '@/shared/units';
import { DEMO_PROJECT } from '../../server/seeders/demo-project';
import { makeTestQueryClient, renderWithQuery } from './render';

jest.mock('@/hooks/api', () => ({ api: {} }));
// The screen is rendered without a navigator: the tab title and links are not under test here.
jest.mock('@/components/ui/page-title', () => ({ PageTitle: () => null }));
jest.mock('@/components/ui/text-link', () => ({ TextLink: ({ label }: { label: string }) => label }));

const STAMP = '2026-01-01T00:00:00.000Z';

function item(id: number, diameterM: number, radiusM: number): CatalogueItemDto {
  return {
    id,
    code: `DEMO-R${diameterM * 1000}`,
    name: `Round ${diameterM * 1000} mm (demo)`,
    mirror: { shape: 'round', diameterM, radiusM },
    material: 'acrylic',
    reflectance: null,
    massKg: null,
    unitPriceMinor: 10000,
    currency: 'EUR',
    notes: '',
    active: true,
    demo: true,
    version: 1,
    updatedAt: STAMP,
  };
}

/** The demo catalogue's two round mirrors, as the seeded placements use them. */
const catalogue = [item(1, 0.8, 1.6), item(2, 0.6, 1.2)];

function demoProject(canEdit: boolean): ProjectDto {
  const placements: PlacementDto[] = DEMO_PROJECT.placements.map((p, i) => ({
    id: i + 1,
    projectId: 7,
    label: p.label,
    catalogueItemId: p.code === 'DEMO-R800' ? 1 : 2,
    customMirror: null,
    positionM: p.positionM,
    heightM: p.heightM,
    azimuthRad: (p.azimuthDeg * Math.PI) / 180,
    tiltDownRad: (p.tiltDownDeg * Math.PI) / 180,
    viewerId: p.viewerId,
    notes: '',
    version: 1,
    updatedAt: STAMP,
  }));
  return {
    id: 7,
    name: DEMO_PROJECT.name,
    customer: DEMO_PROJECT.customer,
    site: DEMO_PROJECT.site,
    kind: 'site',
    status: 'draft',
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
      expect(screen.getByTestId(`zone-pct-${zone.id}`)).toHaveTextContent(formatPercent(fraction));
      expect(screen.getByTestId(`zone-label-${zone.id}`)).toHaveTextContent(`${zone.name} · ${formatPercent(fraction)}`);
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
