/** Request shapes of the templates routes (the wire types live in shared/api/templates.ts). */
export { sectionTemplatesParamsSchema, templateParamsSchema, templateQuerySchema } from '@shared/api/templates';
