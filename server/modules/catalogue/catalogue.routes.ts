import { Router } from 'express';
import { LockMode } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/knex';
import type { z } from 'zod';
import { createCatalogueItemBody, idParam, patchCatalogueItemBody } from '../../../shared/schemas';
import { HttpError, notFound } from '../../http-error';
import { requireRole, requireUser } from '../../middleware/auth';
import { parseOr400 } from '../../middleware/validate';
import { assignMirror, toCatalogueItemDto } from './catalogue.dto';
import { MirrorModel } from './mirror-model.entity';
import { visibleCatalogue } from '../projects/project-access';
import { onDuplicate, onStaleVersion } from '../../write-conflicts';
import { requestEm } from '../../middleware/request-context';
import { withdrawApprovalsUsing } from '../review/review-service';
import type { User } from '../users/user.entity';
import type { SheetWork } from '../../workers/sheet-pool';

onDuplicate(
  'mirror_model.code',
  () => new HttpError(409, 'Another catalogue item already uses this code.', { code: 'This code is already in use.' }),
);
onStaleVersion(MirrorModel, 'catalogue item', async (em, stale) => toCatalogueItemDto(await em.findOneOrFail(MirrorModel, stale.id)));

export function catalogueRoutes(work: SheetWork): Router {
  const r = Router();

  r.get('/', requireUser, async (req, res) => {
    const items = await requestEm().find(MirrorModel, visibleCatalogue(req.user!.organization.id), {
      orderBy: { shape: 'asc', code: 'asc' },
    });
    res.json({ items: items.map(toCatalogueItemDto) });
  });

  r.post('/', requireRole('admin'), async (req, res) => {
    const body = parseOr400(createCatalogueItemBody, req.body, 'The catalogue item');
    const em = requestEm();
    const organization = req.user!.organization.id;
    const { mirror, ...rest } = body;
    const item = em.create(MirrorModel, { ...rest, organization, shape: mirror.shape });
    assignMirror(item, mirror);
    await em.flush();
    res.status(201).json({ item: toCatalogueItemDto(item) });
  });

  r.patch('/:id', requireRole('admin'), async (req, res) => {
    const id = parseOr400(idParam, req.params.id, 'The address');
    const body = parseOr400(patchCatalogueItemBody, req.body, 'The catalogue item');
    const em = requestEm();
    await em.begin();
    try {
      const item = await patchItem(em, req.user!, id, body);
      await em.commit();
      res.json({ item: toCatalogueItemDto(item) });
    } catch (e) {
      // A failed commit has already rolled back (PostgreSQL reports it so); roll back only what is open.
      if (em.isInTransaction()) await em.rollback();
      throw e;
    }
  });

  /** The change, and in the same transaction the withdrawal rule for every approved job that uses the item. */
  async function patchItem(em: EntityManager, user: User, id: number, body: z.output<typeof patchCatalogueItemBody>) {
    const item = await em.findOne(MirrorModel, { $and: [{ id }, visibleCatalogue(user.organization.id)] });
    if (!item) throw notFound('That catalogue item');
    if (!item.organization) {
      throw new HttpError(
        403,
        'The demo catalogue is shared and read-only. Add the mirror to your own catalogue under a new code to change it.',
      );
    }
    await em.lock(item, LockMode.OPTIMISTIC, body.version);
    const { mirror, version: _v, ...rest } = body;
    em.assign(item, rest);
    if (mirror) assignMirror(item, mirror);
    await em.flush();
    await withdrawApprovalsUsing(em, item, user, work);
    return item;
  }

  return r;
}
