import '@testing-library/jest-dom';
import { render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { CommentForm, pinFor } from '@/components/review/comment-form';
import { CommentList } from '@/components/review/comment-list';
import { pinPointM, threadsOf } from '@/components/review/comment-threads';
import type { CommentDto } from '@/shared/schemas';

/** Invented demo comments. */
function comment(id: number, over: Partial<CommentDto> = {}): CommentDto {
  return {
    id,
    projectId: 1,
    parentId: null,
    authorId: 2,
    authorName: 'Rosa Demo',
    authorRole: 'reviewer',
    body: `Comment ${id}`,
    pin: { kind: 'job' },
    isReturnReason: false,
    resolved: false,
    createdAt: `2026-12-02T10:0${id}:00.000Z`,
    ...over,
  };
}

const placements = [{ id: 5, label: 'M2', positionM: [3, 4] as [number, number] }];
const noop = () => Promise.resolve();

describe('comment threads', () => {
  it('numbers threads in the order they were opened and puts each reply under its thread', () => {
    const threads = threadsOf([comment(3), comment(1), comment(2, { parentId: 1 })]);
    expect(threads.map((t) => [t.number, t.root.id, t.replies.map((r) => r.id)])).toEqual([
      [1, 1, [2]],
      [2, 3, []],
    ]);
  });

  it('places a mirror’s pin at the mirror and has no place for a removed mirror or the whole job', () => {
    expect(pinPointM({ kind: 'placement', placementId: 5 }, placements)).toEqual([3, 4]);
    expect(pinPointM({ kind: 'placement', placementId: 99 }, placements)).toBeNull();
    expect(pinPointM({ kind: 'job' }, placements)).toBeNull();
  });

  it('shows markup in a comment as the characters typed, never as markup', () => {
    const body = '<b>bold</b> <img src=x onerror=alert(1)>';
    const { container } = render(
      <CommentList
        threads={threadsOf([comment(1, { body })])}
        placements={placements}
        canResolve={false}
        canReply={false}
        onReply={noop}
        onResolve={noop}
      />,
    );
    expect(screen.getByTestId('comment-body-1')).toHaveTextContent(body);
    expect(container.querySelector('img')).toBeNull();
    expect(container.querySelector('b')).toBeNull();
  });

  it('offers Mark resolved only to the job’s installer, and sends the thread’s id', async () => {
    const user = userEvent.setup();
    const onResolve = jest.fn(noop);
    const threads = threadsOf([comment(1, { pin: { kind: 'placement', placementId: 5 }, isReturnReason: true })]);
    const { rerender } = render(
      <CommentList threads={threads} placements={placements} canResolve={false} canReply onReply={noop} onResolve={onResolve} />,
    );
    expect(screen.queryByTestId('comment-resolve-1')).not.toBeInTheDocument();
    expect(screen.getByTestId('comment-thread-1')).toHaveTextContent('On mirror M2');
    expect(screen.getByTestId('comment-thread-1')).toHaveTextContent('Reason for return');
    rerender(<CommentList threads={threads} placements={placements} canResolve canReply onReply={noop} onResolve={onResolve} />);
    await user.click(screen.getByTestId('comment-resolve-1'));
    expect(onResolve).toHaveBeenCalledWith(1, true);
  });
});

describe('the comment form', () => {
  const base = {
    selectedPlacement: null,
    pickedPointM: null,
    pickingPoint: false,
    onPinChoice: jest.fn(),
    onPickPoint: jest.fn(),
  };

  it('pins to the mirror selected on the plan', async () => {
    const user = userEvent.setup();
    const onSubmit = jest.fn(noop);
    render(<CommentForm {...base} selectedPlacement={{ id: 5, label: 'M2' }} pinChoice="placement" onSubmit={onSubmit} />);
    await user.type(screen.getByTestId('comment-body'), 'Aim M2 lower.');
    await user.click(screen.getByTestId('comment-submit'));
    await waitFor(() => expect(onSubmit).toHaveBeenCalledWith('Aim M2 lower.', { kind: 'placement', placementId: 5 }));
  });

  it('says to choose the point first, and sends nothing, when no point has been tapped', async () => {
    const user = userEvent.setup();
    const onSubmit = jest.fn(noop);
    render(<CommentForm {...base} pinChoice="point" onSubmit={onSubmit} />);
    await user.type(screen.getByTestId('comment-body'), 'Here.');
    await user.click(screen.getByTestId('comment-submit'));
    expect(await screen.findByTestId('comment-error')).toHaveTextContent('Choose the point on the plan first');
    expect(onSubmit).not.toHaveBeenCalled();
  });

  it('builds a point pin from the tapped point', () => {
    expect(pinFor('point', null, [1.25, -2])).toEqual({ kind: 'point', pointM: [1.25, -2] });
    expect(pinFor('placement', null, [1, 1])).toBeNull();
  });
});
