import { z } from 'zod';

export const siteRoleSchema = z.enum(['admin']);
export const courseRoleSchema = z.enum(['lecturer', 'assistant', 'student']);
export type CourseRole = z.infer<typeof courseRoleSchema>;

/** What GET /api/v1/me answers for a signed-in person. */
export const currentUserSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  displayName: z.string(),
  isAdmin: z.boolean(),
  /** One entry per course the person teaches on or is enrolled in. */
  courses: z.array(
    z.object({
      courseId: z.number().int(),
      code: z.string(),
      title: z.string(),
      role: courseRoleSchema,
    }),
  ),
  /** Roles summarised for navigation: 'admin' | 'lecturer' | 'assistant' | 'student'. */
  roles: z.array(z.enum(['admin', 'lecturer', 'assistant', 'student'])),
});
export type CurrentUser = z.infer<typeof currentUserSchema>;

/** GET /api/v1/csrf-token → { token }; send it back as the x-csrf-token header on POST/PUT/PATCH/DELETE. */
export const csrfTokenSchema = z.object({ token: z.string() });

/**
 * Sign-in is a browser redirect: GET /auth/login?returnTo=/path starts the
 * OpenID Connect flow; the provider sends the browser to /auth/callback, which
 * redirects to returnTo. POST /auth/logout (CSRF-protected) ends the session
 * here and at the provider (answers { redirect } with the provider's end-session URL).
 */
export const logoutResponseSchema = z.object({ redirect: z.string() });
