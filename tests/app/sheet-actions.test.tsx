import '@testing-library/jest-dom';
import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { SheetActions } from '@/components/sheet';
import { api } from '@/hooks/api';
import { saveFile } from '@/components/sheet/save-file';
import { sheetKeys } from '@/hooks/use-sheet';
import { ApiError } from '@/shared/api-client';
import { sessionKeys } from '@/hooks/use-session';
import type { SheetEmailResponse, SheetRevisionDto, SheetStatusDto, UserDto } from '@/shared/schemas';
import { testUser } from './fixtures';
import { makeTestQueryClient, renderWithQuery } from './render';

jest.mock('@/hooks/api', () => ({
  api: {
    auth: { session: jest.fn() },
    sheets: { status: jest.fn(), issue: jest.fn(), pdfPath: jest.fn(), download: jest.fn(), email: jest.fn(), recipient: jest.fn() },
  },
}));
jest.mock('@/components/sheet/save-file', () => ({ canSaveFiles: true, saveFile: jest.fn() }));

const PROJECT_ID = 7;

const INSTALLER: UserDto = testUser();

function revision(number: number, overrides: Partial<SheetRevisionDto> = {}): SheetRevisionDto {
  return {
    number,
    contentHash: `${number}`.repeat(64).slice(0, 64),
    issuedAt: `2026-12-0${number}T09:30:00.000Z`,
    issuedBy: 'Ines Okafor',
    ...overrides,
  };
}

function status(revisions: SheetRevisionDto[], changedSinceLast: boolean, approved = false): SheetStatusDto {
  const last = revisions[0];
  const next = last ? (changedSinceLast ? last.number + 1 : last.number) : 1;
  return {
    revisions,
    current: { number: next, contentHash: 'f'.repeat(64), changedSinceLast, approved },
    filename: `sightfan-demo-rev${next}.pdf`,
  };
}

/** A client already holding the sheet's status, so the component renders without asking the (mocked) API. */
function renderWithStatus(s: SheetStatusDto, signedIn: UserDto = INSTALLER) {
  jest.mocked(api.sheets.status).mockResolvedValue(s);
  jest.mocked(api.auth.session).mockResolvedValue({ user: signedIn });
  const client = makeTestQueryClient();
  client.setQueryData(sheetKeys.status(PROJECT_ID), s);
  client.setQueryData(sessionKeys.me(), signedIn);
  return renderWithQuery(<SheetActions projectId={PROJECT_ID} canEdit />, client);
}

beforeEach(() => jest.resetAllMocks());

describe('SheetActions', () => {
  it('shows the last issued revision and says the project has changed since, naming the next revision', () => {
    const last = revision(3);
    const s = status([last, revision(2)], true);
    renderWithStatus(s);

    const line = screen.getByTestId('sheet-revision');
    expect(line).toHaveTextContent(`revision ${last.number}, ${last.issuedAt.slice(0, 10)}, by ${last.issuedBy}`);
    expect(line).toHaveTextContent(`changed since; the next sheet will be revision ${s.current.number}`);
  });

  it('shows only the last issued revision when nothing has changed since', () => {
    const last = revision(4, { issuedBy: 'Oskar Lindqvist' });
    renderWithStatus(status([last], false));

    const line = screen.getByTestId('sheet-revision');
    expect(line).toHaveTextContent(`revision ${last.number}, ${last.issuedAt.slice(0, 10)}, by ${last.issuedBy}`);
    expect(line).not.toHaveTextContent('changed since');
  });

  it('says that no sheet has been issued yet when there is no revision', () => {
    renderWithStatus(status([], true));
    expect(screen.getByTestId('sheet-revision')).toHaveTextContent('No sheet issued yet');
  });

  it('shows a message beside an address that is not one and sends nothing', async () => {
    renderWithStatus(status([revision(1)], false));
    const user = userEvent.setup();

    await user.type(screen.getByTestId('sheet-email-to'), 'buyer at purchasing');
    await user.click(screen.getByTestId('sheet-email-submit'));

    expect(await screen.findByTestId('field-error-to')).toHaveTextContent('Enter a full e-mail address');
    expect(api.sheets.email).not.toHaveBeenCalled();
  });

  it("shows the server's objection to the address beside the address field", async () => {
    const objection = 'The mail server refused this address; check the spelling.';
    jest.mocked(api.sheets.email).mockRejectedValue(new ApiError(400, 'Check the highlighted field.', { to: objection }));
    renderWithStatus(status([revision(1)], false, true));
    const user = userEvent.setup();

    await user.type(screen.getByTestId('sheet-email-to'), 'buyer@purchasing-demo.example');
    await user.click(screen.getByTestId('sheet-email-submit'));

    expect(await screen.findByTestId('field-error-to')).toHaveTextContent(objection);
    expect(screen.queryByTestId('sheet-email-sent')).not.toBeInTheDocument();
  });

  it('sends the address and note, then says which revision went to whom and clears the form', async () => {
    const to = 'buyer.desk@purchasing-demo.example';
    const note = 'For the purchase request, please.';
    const sent: SheetEmailResponse = {
      revision: revision(5),
      to,
      filename: 'sightfan-demo-rev5.pdf',
      delivery: 'sent',
      approved: false,
      outsideOrganisation: true,
    };
    jest.mocked(api.sheets.email).mockResolvedValue(sent);
    renderWithStatus(status([revision(4)], true, true));
    const user = userEvent.setup();

    await user.type(screen.getByTestId('sheet-email-to'), to);
    await user.type(screen.getByTestId('sheet-email-note'), note);
    await user.click(screen.getByTestId('sheet-email-submit'));

    expect(await screen.findByTestId('sheet-email-sent')).toHaveTextContent(`Sheet revision ${sent.revision.number} sent to ${sent.to}.`);
    await waitFor(() => expect(api.sheets.email).toHaveBeenCalledWith(PROJECT_ID, { to, message: note }));
    expect(screen.getByTestId('sheet-email-to')).toHaveValue('');
  });

  it('issues a revision with an explicit request first, then downloads exactly that revision', async () => {
    const issued = revision(6);
    jest.mocked(api.sheets.issue).mockResolvedValue({ revision: issued, created: true, filename: 'sightfan-demo-rev6.pdf' });
    const file = { blob: new Blob(['%PDF-1.7']), filename: 'sightfan-demo-rev6.pdf', revision: 6 };
    jest.mocked(api.sheets.download).mockResolvedValue(file);
    renderWithStatus(status([revision(5)], true));
    const user = userEvent.setup();

    await user.click(screen.getByTestId('sheet-download'));

    await waitFor(() => expect(saveFile).toHaveBeenCalledWith(file));
    expect(api.sheets.issue).toHaveBeenCalledWith(PROJECT_ID);
    expect(api.sheets.download).toHaveBeenCalledWith(PROJECT_ID, issued.number, undefined);
    expect(jest.mocked(api.sheets.issue).mock.invocationCallOrder[0]).toBeLessThan(
      jest.mocked(api.sheets.download).mock.invocationCallOrder[0],
    );
  });

  it('shows why the sheet could not be prepared when issuing fails, and downloads nothing', async () => {
    const busy =
      'Working out this sheet took longer than 20 s, so it was stopped to keep Sightfan answering everyone else. Try again in a minute.';
    jest.mocked(api.sheets.issue).mockRejectedValue(new ApiError(503, busy, {}, 30));
    renderWithStatus(status([revision(5)], true));
    const user = userEvent.setup();

    await user.click(screen.getByTestId('sheet-download'));

    expect(await screen.findByTestId('sheet-download-error')).toHaveTextContent('took longer than 20 s');
    expect(api.sheets.download).not.toHaveBeenCalled();
  });

  describe('e-mailing a sheet that is not approved', () => {
    const sentTo = (to: string): SheetEmailResponse => ({
      revision: revision(2),
      to,
      filename: 'sightfan-demo-rev2.pdf',
      delivery: 'sent',
      approved: false,
      outsideOrganisation: true,
    });

    it('warns and sends nothing until the person confirms an address outside the organisation, then sends it', async () => {
      const to = 'buyer@purchasing-demo.example';
      jest.mocked(api.sheets.recipient).mockResolvedValue({ outsideOrganisation: true });
      jest.mocked(api.sheets.email).mockResolvedValue(sentTo(to));
      renderWithStatus(status([revision(2)], false, false));
      const user = userEvent.setup();

      await user.type(screen.getByTestId('sheet-email-to'), to);
      await user.click(screen.getByTestId('sheet-email-submit'));

      expect(await screen.findByTestId('sheet-email-confirm')).toHaveTextContent(`not approved, and ${to} is outside your organisation`);
      expect(api.sheets.recipient).toHaveBeenCalledWith(PROJECT_ID, to);
      expect(api.sheets.email).not.toHaveBeenCalled();

      await user.click(screen.getByTestId('sheet-email-confirm-send'));
      await waitFor(() => expect(api.sheets.email).toHaveBeenCalledWith(PROJECT_ID, { to, message: undefined }));
      expect(await screen.findByTestId('sheet-email-sent')).toHaveTextContent(to);
    });

    it("sends nothing when the person answers Don't send", async () => {
      jest.mocked(api.sheets.recipient).mockResolvedValue({ outsideOrganisation: true });
      renderWithStatus(status([revision(2)], false, false));
      const user = userEvent.setup();

      await user.type(screen.getByTestId('sheet-email-to'), 'buyer@purchasing-demo.example');
      await user.click(screen.getByTestId('sheet-email-submit'));
      await user.click(await screen.findByTestId('sheet-email-confirm-cancel'));

      expect(screen.queryByTestId('sheet-email-confirm')).not.toBeInTheDocument();
      expect(api.sheets.email).not.toHaveBeenCalled();
    });

    it('sends without asking to an address the server counts as a colleague, whatever its domain', async () => {
      // A colleague of the organisation whose address is at another domain than the installer's.
      const to = 'safety.officer@client-site-demo.example';
      jest.mocked(api.sheets.recipient).mockResolvedValue({ outsideOrganisation: false });
      jest.mocked(api.sheets.email).mockResolvedValue(sentTo(to));
      renderWithStatus(status([revision(2)], false, false));
      const user = userEvent.setup();

      await user.type(screen.getByTestId('sheet-email-to'), to);
      await user.click(screen.getByTestId('sheet-email-submit'));

      await waitFor(() => expect(api.sheets.email).toHaveBeenCalledTimes(1));
      expect(screen.queryByTestId('sheet-email-confirm')).not.toBeInTheDocument();
    });

    it('asks about an address at the installer’s own domain when the server says it is no one in the organisation', async () => {
      const to = 'stranger@fitters-demo.example';
      jest.mocked(api.sheets.recipient).mockResolvedValue({ outsideOrganisation: true });
      renderWithStatus(status([revision(2)], false, false));
      const user = userEvent.setup();

      await user.type(screen.getByTestId('sheet-email-to'), to);
      await user.click(screen.getByTestId('sheet-email-submit'));

      expect(await screen.findByTestId('sheet-email-confirm')).toHaveTextContent(`${to} is outside your organisation`);
      expect(api.sheets.email).not.toHaveBeenCalled();
    });

    it('asks when the server cannot say where the address belongs', async () => {
      jest.mocked(api.sheets.recipient).mockRejectedValue(new ApiError(503, 'The server is busy.', {}));
      renderWithStatus(status([revision(2)], false, false));
      const user = userEvent.setup();

      await user.type(screen.getByTestId('sheet-email-to'), 'stores@fitters-demo.example');
      await user.click(screen.getByTestId('sheet-email-submit'));

      expect(await screen.findByTestId('sheet-email-confirm')).toBeInTheDocument();
      expect(api.sheets.email).not.toHaveBeenCalled();
    });

    it("shows the server's sentence and the wait when outside e-mails are over the hourly limit (429)", async () => {
      const limit = 'You have e-mailed 20 sheets outside your organisation in the last hour, which is the limit.';
      jest.mocked(api.sheets.email).mockRejectedValue(new ApiError(429, limit, {}, 1800));
      renderWithStatus(status([revision(2)], false, true));
      const user = userEvent.setup();

      await user.type(screen.getByTestId('sheet-email-to'), 'buyer@purchasing-demo.example');
      await user.click(screen.getByTestId('sheet-email-submit'));

      const error = await screen.findByTestId('sheet-email-error');
      expect(error).toHaveTextContent(limit);
      expect(error).toHaveTextContent('Try again in 30 minutes.');
      // An approved sheet never asks, so nothing asked where the address belongs.
      expect(api.sheets.recipient).not.toHaveBeenCalled();
    });
  });
});
