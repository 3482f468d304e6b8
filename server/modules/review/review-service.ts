/**
 * The review rules that other modules call inside their own transactions: the one withdrawal rule,
 * the project version bump for mirror writes, and the open-comment counts the project DTOs carry.
 */
import { raw } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/knex';
import { runCompiled } from '../../compiled-query';
import type { MirrorModel } from '../catalogue/mirror-model.entity';
import { Placement } from '../projects/placement.entity';
import { Project } from '../projects/project.entity';
import { currentHash } from '../sheets/sheet-service';
import type { User } from '../users/user.entity';
import type { SheetWork } from '../../workers/sheet-pool';
import { recordEvent } from './audit';

/** The approval columns cleared, the job back to being drawn up. */
export const WITHDRAWN = {
  state: 'drawing_up' as const,
  approvedBy: null,
  approvedByName: null,
  approvedByRole: null,
  approvedAt: null,
  approvedRevision: null,
  approvedHash: null,
};

/**
 * The one withdrawal rule: an approved job whose content hash (as it stands in this unit of work)
 * no longer equals the approved hash goes back to being drawn up, with an `approval_withdrawn`
 * event in the same transaction. Returns the columns to write, or null when nothing is withdrawn.
 */
export async function withdrawalIfChanged(
  em: EntityManager,
  project: Project,
  actor: User,
  work: SheetWork,
  because = 'the job changed after it was approved',
): Promise<typeof WITHDRAWN | null> {
  if (project.state !== 'approved' || !project.approvedHash) return null;
  const hash = await currentHash(em, project, work);
  if (hash === project.approvedHash) return null;
  recordEvent(em, {
    projectId: project.id,
    kind: 'approval_withdrawn',
    actor,
    summary: `The approval of revision ${project.approvedRevision} was withdrawn: ${because}.`,
    detail: { revision: project.approvedRevision, approvedHash: project.approvedHash, contentHash: hash },
  });
  return WITHDRAWN;
}

/**
 * After a mirror write (already flushed in this transaction): withdraws the approval if the content
 * changed, and raises the project's version atomically (`version = version + 1`), so two writes to
 * two different mirrors never conflict on the project. Returns the project's new version.
 */
export async function afterPlacementWrite(em: EntityManager, project: Project, actor: User, work: SheetWork): Promise<number> {
  const withdrawn = await withdrawalIfChanged(em, project, actor, work);
  await em.flush();
  await em.nativeUpdate(
    Project,
    { id: project.id },
    { ...(withdrawn ?? {}), updatedAt: new Date(), version: raw<Project, number>('version + 1') },
  );
  const rows = await em.execute<{ version: number }[]>('select version from project where id = ?', [project.id]);
  return Number(rows[0].version);
}

/**
 * A catalogue item's optics are part of every job that uses it: after a change to the item (flushed
 * in this transaction), each approved job whose content hash moved is withdrawn and its version raised.
 */
export async function withdrawApprovalsUsing(em: EntityManager, item: MirrorModel, actor: User, work: SheetWork): Promise<void> {
  const uses = await em.find(Placement, { catalogueItem: item.id }, { fields: ['project'] });
  const ids = [...new Set(uses.map((p) => p.project.id))];
  if (!ids.length) return;
  const approved = await em.find(Project, { id: { $in: ids }, state: 'approved' }, { populate: ['owner', 'organization'] });
  for (const project of approved) {
    const withdrawn = await withdrawalIfChanged(em, project, actor, work, `catalogue item ${item.code} changed`);
    if (!withdrawn) continue;
    await em.flush();
    await em.nativeUpdate(
      Project,
      { id: project.id },
      { ...withdrawn, updatedAt: new Date(), version: raw<Project, number>('version + 1') },
    );
  }
  await em.flush();
}

/** Open (unresolved) comment threads per project. */
export async function openCommentCounts(em: EntityManager, ids: number[]): Promise<Map<number, number>> {
  const counts = new Map<number, number>();
  if (!ids.length) return counts;
  // Built with knex so each database gets its own boolean literal (SQLite 0, PostgreSQL false).
  const rows = await em.execute<{ project_id: number; n: number | string }[]>(
    em
      .getKnex()('project_comment')
      .select('project_id')
      .count({ n: '*' })
      .whereNull('parent_id')
      .where('resolved', false)
      .whereIn('project_id', ids)
      .groupBy('project_id'),
  );
  for (const row of rows) counts.set(Number(row.project_id), Number(row.n));
  return counts;
}

export async function openCommentCount(em: EntityManager, id: number): Promise<number> {
  // One job's count is asked on every read of a job: its SQL is kept (server/compiled-query.ts).
  const [row] = await runCompiled<{ n: number | string }>(em, 'comments:open-count', { id }, (slot) =>
    em.getKnex()('project_comment').count({ n: '*' }).whereNull('parent_id').where('resolved', false).where('project_id', slot('id')),
  );
  return Number(row?.n ?? 0);
}
