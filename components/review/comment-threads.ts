/** Comments as threads, numbered in the order they were opened, so a marker and its list entry share a number. Pure. */
import type { CommentDto, CommentPin, PlacementDto } from '@/shared/schemas';

export interface CommentThread {
  /** 1-based, in the order threads were opened: the number on the plan's marker. */
  number: number;
  root: CommentDto;
  replies: CommentDto[];
}

const byTime = (a: CommentDto, b: CommentDto) => a.createdAt.localeCompare(b.createdAt) || a.id - b.id;

export function threadsOf(comments: readonly CommentDto[]): CommentThread[] {
  const roots = comments.filter((c) => c.parentId === null).sort(byTime);
  const ids = new Set(roots.map((r) => r.id));
  const replies = new Map<number, CommentDto[]>();
  for (const c of comments) {
    if (c.parentId === null || !ids.has(c.parentId)) continue;
    replies.set(c.parentId, [...(replies.get(c.parentId) ?? []), c]);
  }
  return roots.map((root, i) => ({ number: i + 1, root, replies: (replies.get(root.id) ?? []).sort(byTime) }));
}

/** Where a pin sits on the plan, metres; null for the job as a whole or a mirror no longer there. */
export function pinPointM(pin: CommentPin, placements: readonly Pick<PlacementDto, 'id' | 'positionM'>[]): [number, number] | null {
  if (pin.kind === 'point') return [pin.pointM[0], pin.pointM[1]];
  if (pin.kind === 'placement') {
    const p = placements.find((x) => x.id === pin.placementId);
    return p ? [p.positionM[0], p.positionM[1]] : null;
  }
  return null;
}

/** "On mirror M2", "At a point on the plan", "On the whole job". */
export function pinText(pin: CommentPin, placements: readonly Pick<PlacementDto, 'id' | 'label'>[]): string {
  if (pin.kind === 'job') return 'On the whole job';
  if (pin.kind === 'point') return 'At a point on the plan';
  const p = placements.find((x) => x.id === pin.placementId);
  return p ? `On mirror ${p.label || `#${p.id}`}` : 'On a mirror since removed';
}
