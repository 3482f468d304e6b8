import { Router } from 'express';
import { UniqueConstraintViolationException } from '@mikro-orm/core';
import { createCatalogueItemBody, idParam, patchCatalogueItemBody } from '../../../shared/schemas';
import { changedElsewhere } from '../../../shared/errors';
import type { Orm } from '../../db';
import { HttpError, notFound } from '../../http-error';
import { requireRole, requireUser } from '../../middleware/auth';
import { parseOr400 } from '../../middleware/validate';
import { assignMirror, toCatalogueItemDto } from './catalog.dto';
import { MirrorModel } from './mirror-model.entity';

const duplicateCode = () => new HttpError(409, 'Another catalogue item already uses this code.', { code: 'This code is already in use.' });

export function catalogRoutes(orm: Orm): Router {
  const r = Router();

  r.get('/', requireUser, async (_req, res) => {
    const items = await orm.em.fork().find(MirrorModel, {}, { orderBy: { shape: 'asc', code: 'asc' } });
    res.json({ items: items.map(toCatalogueItemDto) });
  });

  r.post('/', requireRole('admin'), async (req, res) => {
    const body = parseOr400(createCatalogueItemBody, req.body, 'The catalogue item');
    const em = orm.em.fork();
    if (await em.count(MirrorModel, { code: body.code })) throw duplicateCode();
    const { mirror, ...rest } = body;
    const item = em.create(MirrorModel, { ...rest, shape: mirror.shape });
    assignMirror(item, mirror);
    try {
      await em.flush();
    } catch (e) {
      if (e instanceof UniqueConstraintViolationException) throw duplicateCode();
      throw e;
    }
    res.status(201).json({ item: toCatalogueItemDto(item) });
  });

  r.patch('/:id', requireRole('admin'), async (req, res) => {
    const id = parseOr400(idParam, req.params.id, 'The address');
    const body = parseOr400(patchCatalogueItemBody, req.body, 'The catalogue item');
    const em = orm.em.fork();
    const item = await em.findOne(MirrorModel, { id });
    if (!item) throw notFound('That catalogue item');
    if (body.version !== item.version) {
      throw new HttpError(409, changedElsewhere('catalogue item'), undefined, undefined, { current: toCatalogueItemDto(item) });
    }
    const { mirror, version: _v, ...rest } = body;
    if (rest.code && rest.code !== item.code && (await em.count(MirrorModel, { code: rest.code }))) throw duplicateCode();
    em.assign(item, rest);
    if (mirror) assignMirror(item, mirror);
    item.version += 1;
    await em.flush();
    res.json({ item: toCatalogueItemDto(item) });
  });

  return r;
}
