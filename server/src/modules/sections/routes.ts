/**
 * /api/v1/courses/:courseId/sections: lecturers and admins manage; assistants
 * read the sections they are assigned to; students and others get 403.
 */
import { Router } from 'express';
import type { Knex } from 'knex';
import { createSectionBodySchema, updateSectionBodySchema } from '@shared/api/sections';
import { validate } from '../../platform/validate';
import { assertNotArchived, assistantSectionIds, courseAccess, managerAccess } from '../courses/scope';
import { sectionParamsSchema, sectionsParamsSchema } from './schema';
import { createSection, listSections, sectionWire, setSectionArchived, updateSection } from './service';

type Params = { courseId: number; sectionId: number };

export function sectionRoutes(db: Knex): Router {
  const r = Router({ mergeParams: true });

  r.get('/', validate({ params: sectionsParamsSchema }), async (req, res) => {
    const { courseId } = req.params as unknown as Params;
    const access = await courseAccess(db, req, courseId, ['lecturer', 'assistant']);
    const only = access.manages ? undefined : await assistantSectionIds(db, req.user!.id, courseId);
    res.json({ sections: await listSections(db, courseId, only) });
  });

  r.post('/', validate({ params: sectionsParamsSchema, body: createSectionBodySchema }), async (req, res) => {
    const { courseId } = req.params as unknown as Params;
    const access = await managerAccess(db, req, courseId);
    assertNotArchived(access.course);
    const id = await createSection(db, req.user!.id, courseId, req.body);
    res.status(201).json(await sectionWire(db, courseId, id));
  });

  r.patch('/:sectionId', validate({ params: sectionParamsSchema, body: updateSectionBodySchema }), async (req, res) => {
    const { courseId, sectionId } = req.params as unknown as Params;
    const access = await managerAccess(db, req, courseId);
    assertNotArchived(access.course);
    await updateSection(db, req.user!.id, courseId, sectionId, req.body);
    res.json(await sectionWire(db, courseId, sectionId));
  });

  for (const [path, archived] of [['archive', true], ['restore', false]] as const) {
    r.post(`/:sectionId/${path}`, validate({ params: sectionParamsSchema }), async (req, res) => {
      const { courseId, sectionId } = req.params as unknown as Params;
      const access = await managerAccess(db, req, courseId);
      assertNotArchived(access.course);
      await setSectionArchived(db, req.user!.id, courseId, sectionId, archived);
      res.json(await sectionWire(db, courseId, sectionId));
    });
  }
  return r;
}
