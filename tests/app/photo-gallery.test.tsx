/**
 * Photos of a mirror and of the job, over a fake fetch: which photos show where, the full photo,
 * deleting only after a confirmation, and a reviewer's read-only view.
 */
import '@testing-library/jest-dom';
import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { PhotoGallery } from '@/components/uploads/photo-gallery';
import type { FileDto } from '@/shared/schemas/files';
import { renderWithQuery } from './render';

/** Invented files of an invented job 7: two photos of mirror 11, one of mirror 12, one of the job, and its plan. */
function file(id: string, kind: 'plan' | 'photo', placementId: number | null): FileDto {
  return {
    id,
    projectId: 7,
    kind,
    contentType: kind === 'plan' ? 'image/png' : 'image/jpeg',
    bytes: 120_000,
    name: `${id}.jpg`,
    widthPx: 1600,
    heightPx: 1200,
    placementId,
    sourcePage: null,
    sourcePages: null,
    createdAt: '2026-12-02T10:00:00.000Z',
    url: `/api/files/${id}`,
    thumbnailUrl: `/api/files/${id}/thumbnail`,
  };
}
const FILES = [
  file('m11a', 'photo', 11),
  file('m11b', 'photo', 11),
  file('m12a', 'photo', 12),
  file('joba', 'photo', null),
  file('plan', 'plan', null),
];

/** jsdom has no fetch or Response: just what the files hook reads of an answer. */
const answer = (status: number, body?: unknown) =>
  ({ status, ok: status >= 200 && status < 300, text: async () => (body === undefined ? '' : JSON.stringify(body)) }) as Response;

let calls: { method: string; url: string }[] = [];
const realFetch = globalThis.fetch;
beforeEach(() => {
  calls = [];
  let files = [...FILES];
  globalThis.fetch = jest.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
    const url = String(input);
    const method = init?.method ?? 'GET';
    calls.push({ method, url });
    if (method === 'GET' && url.endsWith('/api/projects/7/files')) return answer(200, { files });
    const del = /\/api\/files\/([^/]+)$/.exec(url);
    if (method === 'DELETE' && del) {
      files = files.filter((f) => f.id !== del[1]);
      return answer(204);
    }
    return answer(404, { error: 'Not found.' });
  });
});
afterEach(() => {
  globalThis.fetch = realFetch;
});

describe('photos of a mirror', () => {
  it('shows this mirror’s photos only, each as its thumbnail', async () => {
    renderWithQuery(<PhotoGallery projectId={7} placementId={11} canEdit testID="ph" />);
    await screen.findByTestId('ph-thumb-m11a');
    expect(screen.getByTestId('ph-thumb-m11b')).toBeInTheDocument();
    expect(screen.queryByTestId('ph-thumb-m12a')).toBeNull();
    expect(screen.queryByTestId('ph-thumb-joba')).toBeNull();
    expect(screen.queryByTestId('ph-thumb-plan')).toBeNull();
    const img = screen.getByTestId('ph-thumb-m11a').querySelector('img');
    expect(img?.getAttribute('src')).toBe('/api/files/m11a/thumbnail');
  });

  it('shows the job’s own photos (tied to no mirror) in the job’s gallery, and not its plan', async () => {
    renderWithQuery(<PhotoGallery projectId={7} placementId={null} canEdit testID="ph" />);
    await screen.findByTestId('ph-thumb-joba');
    expect(screen.queryByTestId('ph-thumb-m11a')).toBeNull();
    expect(screen.queryByTestId('ph-thumb-plan')).toBeNull();
  });

  it('opens the full photo from its thumbnail', async () => {
    renderWithQuery(<PhotoGallery projectId={7} placementId={11} canEdit testID="ph" />);
    fireEvent.click(await screen.findByTestId('ph-thumb-m11a'));
    const viewer = await screen.findByTestId('ph-viewer');
    expect(within(viewer).getByTestId('ph-viewer-image').querySelector('img')?.getAttribute('src')).toBe('/api/files/m11a');
    fireEvent.click(within(viewer).getByTestId('ph-viewer-close'));
    await waitFor(() => expect(screen.queryByTestId('ph-viewer')).toBeNull());
  });

  it('deletes a photo only after the confirmation, and “Keep it” sends nothing', async () => {
    renderWithQuery(<PhotoGallery projectId={7} placementId={11} canEdit testID="ph" />);
    fireEvent.click(await screen.findByTestId('ph-thumb-m11a'));
    fireEvent.click(await screen.findByTestId('ph-viewer-delete'));
    fireEvent.click(screen.getByTestId('ph-viewer-delete-cancel'));
    expect(calls.some((c) => c.method === 'DELETE')).toBe(false);
    fireEvent.click(screen.getByTestId('ph-viewer-delete'));
    fireEvent.click(screen.getByTestId('ph-viewer-delete-confirm'));
    await waitFor(() => expect(screen.queryByTestId('ph-thumb-m11a')).toBeNull());
    expect(calls).toContainEqual({ method: 'DELETE', url: '/api/files/m11a' });
    expect(screen.getByTestId('ph-thumb-m11b')).toBeInTheDocument();
  });

  it('lets a reviewer look but offers no camera, no chooser and no delete', async () => {
    renderWithQuery(<PhotoGallery projectId={7} placementId={11} canEdit={false} testID="ph" />);
    fireEvent.click(await screen.findByTestId('ph-thumb-m11a'));
    await screen.findByTestId('ph-viewer');
    expect(screen.queryByTestId('ph-viewer-delete')).toBeNull();
    expect(screen.queryByTestId('ph-upload-camera')).toBeNull();
    expect(screen.queryByTestId('ph-upload-choose')).toBeNull();
  });

  it('says so when a mirror has no photos yet', async () => {
    renderWithQuery(<PhotoGallery projectId={7} placementId={99} canEdit testID="ph" />);
    expect(await screen.findByTestId('ph-empty')).toHaveTextContent('No photos yet.');
  });
});
