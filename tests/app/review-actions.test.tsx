import '@testing-library/jest-dom';
import { render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { ReturnForm } from '@/components/review/return-form';
import { ReviewActions } from '@/components/review/review-actions';
import { reviewActionsFor, type ReviewAction } from '@/components/review/review-rules';
import { reviewSentence } from '@/components/review/review-summary';
import { StateBadge } from '@/components/review/state-badge';
import { ApiError } from '@/shared/api-client';
import { PROJECT_STATE_LABELS, projectStates, reviewRules, type ProjectState, type Role } from '@/shared/schemas';

const OWNER = 10;

describe('the state badge', () => {
  it.each(projectStates)('shows the words for %s', (state) => {
    render(<StateBadge state={state} testID="badge" />);
    expect(screen.getByTestId('badge')).toHaveTextContent(PROJECT_STATE_LABELS[state]);
  });
});

describe('the review sentence', () => {
  const fields = { reviewerId: null, reviewerName: null, sentAt: null, approval: null, openCommentCount: 0 };

  it('names who approved, in the app’s word for their role, with the revision and the start of the hash', () => {
    const hash = 'c8330a1e4103' + '0'.repeat(52);
    const sentence = reviewSentence({
      ...fields,
      state: 'approved',
      approval: {
        reviewerId: 4,
        reviewerName: 'Rosa Demo',
        reviewerRole: 'reviewer',
        approvedAt: '2026-12-02T16:19:00.000Z',
        revision: 3,
        contentHash: hash,
      },
    });
    expect(sentence).toContain('Approved by Rosa Demo (Reviewer)');
    expect(sentence).toContain('revision 3');
    expect(sentence).toContain('content hash c8330a1e4103…');
  });

  it('names the reviewer a job was sent to, or says any reviewer may take it', () => {
    expect(reviewSentence({ ...fields, state: 'with_reviewer', reviewerId: 4, reviewerName: 'Rosa Demo' })).toBe(
      'Sent to Rosa Demo for review.',
    );
    expect(reviewSentence({ ...fields, state: 'with_reviewer' })).toContain('any reviewer');
  });
});

describe('who may take which step', () => {
  // From the transition table in shared/schemas/review.ts.
  const cases: [string, Role, number, ProjectState, ReviewAction[]][] = [
    ['the owning installer sends a job being drawn up', 'installer', OWNER, 'drawing_up', ['send', 'resolve']],
    ['the owning installer sends a returned job again', 'installer', OWNER, 'returned', ['send', 'resolve']],
    ['the owning installer cannot approve their own job waiting for review', 'installer', OWNER, 'with_reviewer', ['resolve']],
    ['another installer can take no step', 'installer', 11, 'drawing_up', []],
    ['a reviewer approves or returns a job waiting for review', 'reviewer', 12, 'with_reviewer', ['approve', 'return']],
    ['a reviewer takes no step on a job being drawn up', 'reviewer', 12, 'drawing_up', []],
    ['a reviewer takes no step on an approved job', 'reviewer', 12, 'approved', []],
    ['an admin approves, returns or reassigns a job waiting for review', 'admin', 13, 'with_reviewer', ['approve', 'return', 'reassign']],
  ];
  it.each(cases)('%s', (_name, role, id, state, expected) => {
    expect(reviewActionsFor({ id, role }, { ownerId: OWNER, state })).toEqual(expected);
  });

  const props = {
    reviewers: [{ id: 12, name: 'Rosa Demo', role: 'reviewer' }],
    currentReviewerId: null,
    busy: false,
    error: null,
    showKeys: true,
    onSend: jest.fn(() => Promise.resolve()),
    onApprove: jest.fn(() => Promise.resolve()),
    onReturn: jest.fn(() => Promise.resolve()),
  };

  it('shows a reviewer Approve and Return but no Send', () => {
    render(
      <ReviewActions {...props} actions={reviewActionsFor({ id: 12, role: 'reviewer' }, { ownerId: OWNER, state: 'with_reviewer' })} />,
    );
    expect(screen.getByTestId('review-approve')).toBeInTheDocument();
    expect(screen.getByTestId('review-return')).toBeInTheDocument();
    expect(screen.queryByTestId('review-send')).not.toBeInTheDocument();
    expect(screen.getByTestId('review-keys')).toHaveTextContent('Ctrl+Enter');
  });

  it('shows the owning installer Send with the reviewers to choose from, and sends to the one chosen', async () => {
    const user = userEvent.setup();
    const onSend = jest.fn(() => Promise.resolve());
    render(
      <ReviewActions
        {...props}
        onSend={onSend}
        actions={reviewActionsFor({ id: OWNER, role: 'installer' }, { ownerId: OWNER, state: 'drawing_up' })}
      />,
    );
    expect(screen.queryByTestId('review-approve')).not.toBeInTheDocument();
    await user.click(screen.getByTestId('send-reviewer-12'));
    await user.click(screen.getByTestId('review-send'));
    expect(onSend).toHaveBeenCalledWith(12);
  });

  it('approves with the keyboard alone: Tab to Approve, then Enter', async () => {
    const user = userEvent.setup();
    const onApprove = jest.fn(() => Promise.resolve());
    render(
      <ReviewActions
        {...props}
        onApprove={onApprove}
        actions={reviewActionsFor({ id: 12, role: 'reviewer' }, { ownerId: OWNER, state: 'with_reviewer' })}
      />,
    );
    await user.tab();
    expect(screen.getByTestId('review-approve')).toHaveFocus();
    await user.keyboard('{Enter}');
    expect(onApprove).toHaveBeenCalledTimes(1);
  });

  it('opens the return form from the keyboard with the reason field focused', async () => {
    const user = userEvent.setup();
    render(<ReviewActions {...props} actions={['return']} />);
    await user.tab();
    await user.keyboard('{Enter}');
    expect(await screen.findByTestId('return-reason')).toHaveFocus();
  });
});

describe('the return form', () => {
  it('refuses an empty reason with the rule’s sentence beside the field and sends nothing', async () => {
    const user = userEvent.setup();
    const onSubmit = jest.fn(() => Promise.resolve());
    render(<ReturnForm onSubmit={onSubmit} />);
    await user.click(screen.getByTestId('return-submit'));
    expect(await screen.findByTestId('field-error-reason')).toHaveTextContent(reviewRules.reason.required);
    expect(screen.getByTestId('return-reason')).toHaveAttribute('aria-describedby', 'field-reason-message');
    expect(onSubmit).not.toHaveBeenCalled();
  });

  it('refuses a reason of spaces only, as the route would', async () => {
    const user = userEvent.setup();
    const onSubmit = jest.fn(() => Promise.resolve());
    render(<ReturnForm onSubmit={onSubmit} />);
    await user.type(screen.getByTestId('return-reason'), '    ');
    await user.click(screen.getByTestId('return-submit'));
    expect(await screen.findByTestId('field-error-reason')).toHaveTextContent(reviewRules.reason.required);
    expect(onSubmit).not.toHaveBeenCalled();
  });

  it('refuses a reason one character over the limit with the limit’s sentence', async () => {
    const onSubmit = jest.fn(() => Promise.resolve());
    const user = userEvent.setup();
    render(<ReturnForm onSubmit={onSubmit} />);
    const long = 'x'.repeat(reviewRules.reason.maxLength.value + 1);
    await user.click(screen.getByTestId('return-reason'));
    await user.paste(long);
    await user.click(screen.getByTestId('return-submit'));
    expect(await screen.findByTestId('field-error-reason')).toHaveTextContent(reviewRules.reason.maxLength.message);
    expect(onSubmit).not.toHaveBeenCalled();
  });

  it('sends the reason trimmed', async () => {
    const user = userEvent.setup();
    const onSubmit = jest.fn(() => Promise.resolve());
    render(<ReturnForm onSubmit={onSubmit} />);
    await user.type(screen.getByTestId('return-reason'), '  Mirror 2 shows the racking, not the crossing.  ');
    await user.click(screen.getByTestId('return-submit'));
    await waitFor(() => expect(onSubmit).toHaveBeenCalledWith('Mirror 2 shows the racking, not the crossing.'));
  });

  it('shows the server’s sentence for the reason beside the field', async () => {
    const user = userEvent.setup();
    const said = 'The reason holds a character the sheet cannot print.';
    render(<ReturnForm onSubmit={() => Promise.reject(new ApiError(400, 'Check the highlighted field.', { reason: said }))} />);
    await user.type(screen.getByTestId('return-reason'), 'Fix mirror 2.');
    await user.click(screen.getByTestId('return-submit'));
    expect(await screen.findByTestId('field-error-reason')).toHaveTextContent(said);
    expect(screen.getByTestId('return-error')).toHaveTextContent('Check the highlighted field.');
  });
});
