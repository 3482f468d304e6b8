/**
 * The upload control's states, driven through a stand-in XMLHttpRequest the test answers by hand:
 * progress, cancel, a dropped connection and its retry, and the refusals said beside the control.
 */
import '@testing-library/jest-dom';
import { act, fireEvent, screen } from '@testing-library/react';
import * as fc from 'fast-check';
import { UploadControl } from '@/components/uploads/upload-control';
import { checkBeforeUpload, retryHelps } from '@/components/uploads/upload-request';
import { ApiError } from '@/shared/api-client';
import { FILE_LIMITS, FILE_MESSAGES, type FileDto } from '@/shared/schemas/files';
import { renderWithQuery } from './render';

type Listener = (e: { lengthComputable: boolean; loaded: number; total: number }) => void;

/** Just the parts of XMLHttpRequest the upload uses; the test plays the network. */
class FakeRequest {
  static made: FakeRequest[] = [];
  method = '';
  url = '';
  withCredentials = false;
  status = 0;
  responseText = '';
  headers: Record<string, string> = {};
  sentBody: FormData | null = null;
  aborted = false;
  private listeners: Record<string, (() => void)[]> = {};
  private progress: Listener[] = [];
  upload = { addEventListener: (_: 'progress', fn: Listener) => this.progress.push(fn) };
  constructor() {
    FakeRequest.made.push(this);
  }
  open(method: string, url: string) {
    this.method = method;
    this.url = url;
  }
  setRequestHeader() {}
  getResponseHeader(name: string) {
    return this.headers[name] ?? null;
  }
  addEventListener(type: string, fn: () => void) {
    (this.listeners[type] ??= []).push(fn);
  }
  send(body: FormData) {
    this.sentBody = body;
  }
  abort() {
    this.aborted = true;
    this.fire('abort');
  }
  fire(type: string) {
    for (const fn of this.listeners[type] ?? []) fn();
  }
  sendProgress(loaded: number, total: number) {
    for (const fn of this.progress) fn({ lengthComputable: true, loaded, total });
  }
  answer(status: number, body: string, headers: Record<string, string> = {}) {
    this.status = status;
    this.responseText = body;
    this.headers = headers;
    this.fire('load');
  }
}
const makeRequest = () => new FakeRequest() as unknown as XMLHttpRequest;
const last = () => FakeRequest.made[FakeRequest.made.length - 1];

/** An invented stored photo, as the contract describes it. */
const STORED: FileDto = {
  id: 'f1a2b3c4',
  projectId: 7,
  kind: 'photo',
  contentType: 'image/jpeg',
  bytes: 182_000,
  name: 'dock-mirror.jpg',
  widthPx: 1600,
  heightPx: 1200,
  placementId: 11,
  sourcePage: null,
  sourcePages: null,
  createdAt: '2026-12-02T10:00:00.000Z',
  url: '/api/files/f1a2b3c4',
  thumbnailUrl: '/api/files/f1a2b3c4/thumbnail',
};

function photo(name = 'dock-mirror.jpg', type = 'image/jpeg', size?: number): File {
  const f = new File([new Uint8Array(2000)], name, { type });
  if (size !== undefined) Object.defineProperty(f, 'size', { value: size });
  return f;
}

function choose(testId: string, file: File) {
  const input = screen.getByTestId(testId) as HTMLInputElement;
  Object.defineProperty(input, 'files', { value: [file], configurable: true });
  fireEvent.change(input);
}

function renderControl(onUploaded = jest.fn(), kind: 'photo' | 'plan' = 'photo') {
  return renderWithQuery(
    <UploadControl
      projectId={7}
      kind={kind}
      placementId={kind === 'photo' ? 11 : null}
      testID="up"
      chooseLabel="Choose a photo"
      cameraLabel={kind === 'photo' ? 'Take a photo' : undefined}
      onUploaded={onUploaded}
      makeRequest={makeRequest}
    />,
  );
}

beforeEach(() => {
  FakeRequest.made = [];
});

describe('the upload control', () => {
  it('opens the rear camera at once for a photo and keeps the plain chooser beside it', () => {
    renderControl();
    const camera = screen.getByTestId('up-camera-input');
    expect(camera).toHaveAttribute('capture', 'environment');
    expect(camera).toHaveAttribute('accept', 'image/*');
    expect(screen.getByTestId('up-choose-input')).not.toHaveAttribute('capture');
    expect(screen.getByRole('button', { name: 'Take a photo' })).toBeInTheDocument();
  });

  it('sends the file, its kind and its mirror to the job’s files route with the session cookie', () => {
    renderControl();
    choose('up-camera-input', photo());
    const req = last();
    expect(req.method).toBe('POST');
    expect(req.url).toBe('/api/projects/7/files');
    expect(req.withCredentials).toBe(true);
    expect(req.sentBody?.get('kind')).toBe('photo');
    expect(req.sentBody?.get('placementId')).toBe('11');
    expect((req.sentBody?.get('file') as File).name).toBe('dock-mirror.jpg');
  });

  it('shows the share sent in a progress bar as the browser reports it', () => {
    renderControl();
    choose('up-choose-input', photo());
    act(() => last().sendProgress(800, 2000));
    const bar = screen.getByRole('progressbar');
    expect(bar).toHaveAttribute('aria-valuenow', '40');
    expect(screen.getByTestId('up-progress-text')).toHaveTextContent('40 %');
  });

  it('never shows 100 % before the server has answered', () => {
    renderControl();
    choose('up-choose-input', photo());
    act(() => last().sendProgress(2000, 2000));
    expect(screen.getByRole('progressbar')).toHaveAttribute('aria-valuenow', '99');
  });

  it('cancels the request on Cancel, says nothing was saved and does not report a file', async () => {
    const onUploaded = jest.fn();
    renderControl(onUploaded);
    choose('up-choose-input', photo());
    fireEvent.click(screen.getByTestId('up-cancel'));
    expect(last().aborted).toBe(true);
    expect(await screen.findByTestId('up-cancelled')).toHaveTextContent('was not saved');
    expect(onUploaded).not.toHaveBeenCalled();
    expect(screen.queryByRole('progressbar')).toBeNull();
  });

  it('offers Try again after a dropped connection and sends the same file again', async () => {
    const onUploaded = jest.fn();
    renderControl(onUploaded);
    choose('up-choose-input', photo());
    act(() => last().fire('error'));
    expect(await screen.findByTestId('up-error')).toHaveTextContent('The connection dropped');
    fireEvent.click(screen.getByTestId('up-retry'));
    expect(FakeRequest.made).toHaveLength(2);
    expect((last().sentBody?.get('file') as File).name).toBe('dock-mirror.jpg');
    await act(async () => last().answer(201, JSON.stringify({ file: STORED })));
    expect(onUploaded).toHaveBeenCalledWith(STORED);
    expect(screen.getByTestId('up-done')).toHaveTextContent('dock-mirror.jpg');
  });

  it('goes on sending when the control leaves the screen (the drawer folds) and still reports the stored file', async () => {
    const onUploaded = jest.fn();
    const { unmount } = renderControl(onUploaded);
    choose('up-choose-input', photo());
    unmount();
    expect(last().aborted).toBe(false);
    await act(async () => last().answer(201, JSON.stringify({ file: STORED })));
    expect(onUploaded).toHaveBeenCalledWith(STORED);
  });

  it('refuses a file over the size limit before sending anything, in the contract’s words, with no retry', () => {
    renderControl();
    choose('up-choose-input', photo('huge.jpg', 'image/jpeg', FILE_LIMITS.fileBytes + 1));
    expect(FakeRequest.made).toHaveLength(0);
    expect(screen.getByTestId('up-error')).toHaveTextContent(FILE_MESSAGES.tooLarge);
    expect(screen.getByRole('alert')).toBeInTheDocument();
    expect(screen.queryByTestId('up-retry')).toBeNull();
  });

  it('refuses a PDF as a photo before sending it', () => {
    renderControl();
    choose('up-choose-input', photo('plan.pdf', 'application/pdf'));
    expect(FakeRequest.made).toHaveLength(0);
    expect(screen.getByTestId('up-error')).toHaveTextContent(FILE_MESSAGES.pdfPhoto);
  });

  it('shows the server’s own sentence for a file refused by its bytes (415), with no retry', async () => {
    renderControl();
    choose('up-choose-input', photo('renamed.jpg'));
    const sentence = 'This file is not a PNG or JPEG image, whatever its name says.';
    await act(async () => last().answer(415, JSON.stringify({ error: sentence })));
    expect(screen.getByTestId('up-error')).toHaveTextContent(sentence);
    expect(screen.queryByTestId('up-retry')).toBeNull();
  });

  it('says the file is too large when a proxy answers 413 without the server’s words', async () => {
    renderControl();
    choose('up-choose-input', photo());
    await act(async () => last().answer(413, '<html>Request Entity Too Large</html>'));
    expect(screen.getByTestId('up-error')).toHaveTextContent(FILE_MESSAGES.tooLarge);
  });

  it('offers Try again after a server fault (503)', async () => {
    renderControl();
    choose('up-choose-input', photo());
    await act(async () =>
      last().answer(503, JSON.stringify({ error: 'The server is busy; try again in a moment.' }), { 'Retry-After': '5' }),
    );
    expect(screen.getByTestId('up-error')).toHaveTextContent('The server is busy');
    expect(screen.getByTestId('up-retry')).toBeInTheDocument();
  });

  it('sends a plan’s page when one is given, and no mirror', () => {
    renderWithQuery(
      <UploadControl
        projectId={7}
        kind="plan"
        page={3}
        testID="up"
        chooseLabel="Choose a plan"
        onUploaded={jest.fn()}
        makeRequest={makeRequest}
      />,
    );
    choose('up-choose-input', photo('site.pdf', 'application/pdf'));
    expect(last().sentBody?.get('kind')).toBe('plan');
    expect(last().sentBody?.get('page')).toBe('3');
    expect(last().sentBody?.get('placementId')).toBeNull();
  });
});

describe('the check before sending', () => {
  const kinds = fc.constantFrom('plan' as const, 'photo' as const);
  const anyType = fc.oneof(
    fc.constantFrom(
      'image/png',
      'image/jpeg',
      'application/pdf',
      'image/svg+xml',
      'image/heic',
      'application/x-msdownload',
      'text/html',
      '',
    ),
    fc.string({ maxLength: 30 }),
  );
  const anyName = fc.oneof(fc.string({ maxLength: 40 }), fc.constantFrom('a.png', 'b.JPG', 'c.jpeg', 'd.pdf', 'e.svg', 'f.exe', 'g'));

  it('answers every file, of any name, type, size and kind, with nothing or one of the contract’s sentences', () => {
    const sentences = new Set<string>(Object.values(FILE_MESSAGES));
    fc.assert(
      fc.property(anyName, anyType, fc.integer({ min: 0, max: 4 * FILE_LIMITS.fileBytes }), kinds, (name, type, size, kind) => {
        const said = checkBeforeUpload({ name, type, size }, kind);
        expect(said === null || sentences.has(said)).toBe(true);
        // Nothing empty or over the limit is ever sent, whatever it claims to be.
        if (size === 0 || size > FILE_LIMITS.fileBytes) expect(said).not.toBeNull();
        // A photo is never a PDF.
        if (kind === 'photo' && type === 'application/pdf' && size > 0 && size <= FILE_LIMITS.fileBytes)
          expect(said).toBe(FILE_MESSAGES.pdfPhoto);
      }),
    );
  });

  it('lets through a PNG or JPEG of 1 byte up to exactly the limit for either kind', () => {
    fc.assert(
      fc.property(
        fc.constantFrom('image/png', 'image/jpeg'),
        fc.integer({ min: 1, max: FILE_LIMITS.fileBytes }),
        kinds,
        (type, size, kind) => {
          expect(checkBeforeUpload({ name: 'x', type, size }, kind)).toBeNull();
        },
      ),
    );
  });

  it('goes by the name’s ending only when the browser gives no type', () => {
    expect(checkBeforeUpload({ name: 'plan.PDF', type: '', size: 10 }, 'plan')).toBeNull();
    expect(checkBeforeUpload({ name: 'plan.svg', type: '', size: 10 }, 'plan')).toBe(FILE_MESSAGES.wrongType);
    expect(checkBeforeUpload({ name: 'photo.jpg', type: 'image/svg+xml', size: 10 }, 'photo')).toBe(FILE_MESSAGES.wrongType);
  });

  it('counts a retry as useful only for a dropped connection or a server fault', () => {
    expect(retryHelps(new ApiError(0, 'dropped'))).toBe(true);
    expect(retryHelps(new ApiError(502, 'bad gateway'))).toBe(true);
    for (const status of [400, 403, 404, 413, 415, 422]) expect(retryHelps(new ApiError(status, 'no'))).toBe(false);
  });
});
