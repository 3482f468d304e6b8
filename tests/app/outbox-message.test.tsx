import '@testing-library/jest-dom';
import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { OutboxMessage } from '@/components/outbox/outbox-message';
import { saveFile } from '@/components/sheet/save-file';
import { api } from '@/hooks/api';
import { ApiError } from '@/shared/api-client';
import type { OutboxMessageDto } from '@/shared/schemas';
import { makeTestQueryClient, renderWithQuery } from './render';

jest.mock('@/hooks/api', () => ({ api: { outbox: { list: jest.fn(), attachment: jest.fn() } } }));
jest.mock('@/components/sheet/save-file', () => ({ canSaveFiles: true, saveFile: jest.fn() }));

const FILE = 'sightfan-cold-store-aisles-and-dock-demo-rev3-a4.pdf';
const sheetMail: OutboxMessageDto = {
  id: 41,
  from: 'Sightfan <no-reply@sightfan-demo.example>',
  to: ['buyer.desk@purchasing-demo.example'],
  subject: 'Mirror specification sheet: Cold store aisles and dock (demo), revision 3',
  text: 'Ines Installer (demo) sent you the Sightfan specification sheet.',
  attachments: [{ filename: FILE, contentType: 'application/pdf', size: 181_000 }],
  receivedAt: '2026-12-02T10:00:00.000Z',
  status: 'sent',
  attempts: 1,
  sentAt: '2026-12-02T10:00:01.000Z',
};

beforeEach(() => jest.resetAllMocks());

describe('a sheet e-mail in the outbox', () => {
  it('names its attachment as a button that opens the PDF the buyer received', async () => {
    const file = { blob: new Blob(['%PDF-1.7']), filename: FILE, revision: null };
    jest.mocked(api.outbox.attachment).mockResolvedValue(file);
    renderWithQuery(<OutboxMessage message={sheetMail} />, makeTestQueryClient());

    const button = screen.getByRole('button', { name: `Open ${FILE} (177 KB)` });
    await userEvent.click(button);
    await waitFor(() => expect(saveFile).toHaveBeenCalledWith(file));
    expect(api.outbox.attachment).toHaveBeenCalledWith(41, 0);
  });

  it('says in words why an attachment could not be opened', async () => {
    jest.mocked(api.outbox.attachment).mockRejectedValue(new ApiError(404, 'That e-mail or attachment is not in your outbox.'));
    renderWithQuery(<OutboxMessage message={sheetMail} />, makeTestQueryClient());

    await userEvent.click(screen.getByTestId('outbox-attachment-41-0'));
    expect(await screen.findByTestId('outbox-attachment-error-41-0')).toHaveTextContent('That e-mail or attachment is not in your outbox.');
    expect(saveFile).not.toHaveBeenCalled();
  });
});
