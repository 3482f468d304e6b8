import '@testing-library/jest-dom';
import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { router } from 'expo-router';
import { QuickSizing } from '@/components/quick/quick-sizing';
import { aimText } from '@/components/quick/quick-option-card';
import { api } from '@/hooks/api';
import { catalogueKeys } from '@/hooks/use-catalogue';
import { sessionKeys } from '@/hooks/use-session';
import { SAFETY_CAUTIONS } from '@/shared/cautions';
import { HANGS_WITHIN_M } from '@/shared/project-optics';
import { DEFAULT_QUICK_QUESTION, quickScene } from '@/shared/quick';
import type { UserDto } from '@/shared/schemas';
import { demoCatalogueDtos, testUser } from './fixtures';
import { makeTestQueryClient, renderWithQuery } from './render';

jest.mock('@/hooks/api', () => ({
  api: { auth: { me: jest.fn() }, catalogue: { list: jest.fn() }, projects: { create: jest.fn(), addPlacement: jest.fn() } },
}));
jest.mock('expo-router', () => ({ router: { push: jest.fn() } }));

const INSTALLER: UserDto = testUser();
const catalogue = demoCatalogueDtos();

function renderQuick() {
  jest.mocked(api.auth.me).mockResolvedValue({ user: INSTALLER });
  jest.mocked(api.catalogue.list).mockResolvedValue({ items: catalogue });
  const client = makeTestQueryClient();
  client.setQueryData(sessionKeys.me(), INSTALLER);
  client.setQueryData(catalogueKeys.list(), catalogue);
  return renderWithQuery(<QuickSizing />, client);
}

const firstOption = () => screen.findByTestId('quick-option-1', {}, { timeout: 15000 });

beforeEach(() => jest.resetAllMocks());

describe('Quick sizing', () => {
  it('answers the first question with ranked mirrors, each with its share, aim and fan, and shows the cautions', async () => {
    renderQuick();
    await firstOption();
    expect(screen.getByTestId('quick-option-1-share')).toHaveTextContent(/^Sees \d+ %$/);
    expect(screen.getByTestId('quick-option-1-aim')).toHaveTextContent(/tilt \d+° down/);
    expect(screen.getByTestId('quick-option-1-sketch-fan').getAttribute('d')).toMatch(/^M[\d.]+,[\d.]+L/);
    expect(screen.getByTestId('safety-cautions')).toBeInTheDocument();
  });

  it('heads the ranked answers with a short caution, so a phone scrolled to the answers still has one in view, and opens the four there', async () => {
    renderQuick();
    const option = await firstOption();
    const line = screen.getByTestId('quick-caution-line');
    expect(line).toHaveTextContent('Mirrors show things smaller and farther away than they are.');
    // The line comes before the first answer inside the answers block, not after the list.
    expect(screen.getByTestId('quick-answers')).toContainElement(line);
    expect(line.compareDocumentPosition(option) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
    expect(screen.queryByTestId('quick-caution-full')).toBeNull();
    fireEvent.click(screen.getByTestId('quick-caution-toggle'));
    const full = screen.getByTestId('quick-caution-full');
    expect(line).toContainElement(full);
    for (const c of SAFETY_CAUTIONS) expect(within(full).getByText(c.text)).toBeInTheDocument();
    expect(screen.getByTestId('quick-caution-toggle')).toHaveAttribute('aria-expanded', 'true');
  });

  it('shows no caution line while there is no answer to go with it', async () => {
    renderQuick();
    await firstOption();
    fireEvent.change(screen.getByTestId('quick-passageWidthM'), { target: { value: '0.4' } });
    await screen.findByText('The passage width must be between 1 m and 30 m.');
    expect(screen.queryByTestId('quick-caution-line')).toBeNull();
    // The four cautions stay on the screen all the same.
    expect(screen.getByTestId('safety-cautions')).toBeInTheDocument();
  });

  it('says which measurement is out of range and shows no answer for it', async () => {
    renderQuick();
    await firstOption();
    const field = screen.getByTestId('quick-passageWidthM');
    fireEvent.change(field, { target: { value: '0.4' } });
    expect(await screen.findByText('The passage width must be between 1 m and 30 m.')).toBeInTheDocument();
    expect(screen.queryByTestId('quick-option-1')).toBeNull();
  });

  it('shows a tapped option’s full numbers and side view, and saves it as a job with the quick scene and the mirror placed', async () => {
    jest.mocked(api.projects.create).mockResolvedValue({ project: { id: 41 } } as Awaited<ReturnType<typeof api.projects.create>>);
    jest.mocked(api.projects.addPlacement).mockResolvedValue({} as Awaited<ReturnType<typeof api.projects.addPlacement>>);
    renderQuick();
    fireEvent.click(await firstOption());
    expect(screen.getByTestId('placement-elevation')).toBeInTheDocument();
    expect(screen.getByText('Live numbers')).toBeInTheDocument();
    fireEvent.click(screen.getByTestId('quick-save'));
    await waitFor(() => expect(router.push).toHaveBeenCalledWith('/projects/41'));
    const created = jest.mocked(api.projects.create).mock.calls[0][0];
    expect(created.scene).toEqual(quickScene(DEFAULT_QUICK_QUESTION));
    const [projectId, placement] = jest.mocked(api.projects.addPlacement).mock.calls[0];
    expect(projectId).toBe(41);
    expect(placement.viewerId).toBe('viewer');
    expect(catalogue.map((c) => c.id)).toContain(placement.catalogueItemId);
    // At its place along the far wall, stood off the wall's face by its body (its back on the wall).
    expect(placement.positionM[0]).toBe(DEFAULT_QUICK_QUESTION.mirrorAlongM);
    expect(placement.positionM[1]).toBeLessThan(DEFAULT_QUICK_QUESTION.passageWidthM);
    expect(placement.positionM[1]).toBeGreaterThan(DEFAULT_QUICK_QUESTION.passageWidthM - HANGS_WITHIN_M);
  });
});

describe('the aim in words', () => {
  it('reads a mirror facing halfway between square to its wall and the viewer’s end as a 45° turn toward the viewer', () => {
    // Square on the far wall faces −y (−90°); −135° turns it halfway toward −x, where the viewer stands.
    expect(aimText({ azimuthRad: (-135 * Math.PI) / 180, tiltDownRad: (15 * Math.PI) / 180 })).toBe(
      'Turn 45° from square toward the viewer, tilt 15° down',
    );
  });
});
