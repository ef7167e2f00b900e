// Refuses cross-site writes, reads the session for every server-rendered request, guards pages by
// role, and sets the security headers. Prerendered pages (the technician's offline shell) never
// pass through here at request time: they hold no data, everything they show comes through
// guarded endpoints, and scripts/app-server.mjs gives them the same headers as static files.
import type { APIContext, MiddlewareNext } from 'astro';
import { defineMiddleware } from 'astro:middleware';
import { readSession } from './lib/auth';
import { homeFor, pageAccess } from './lib/route-access';
import { errorResponse } from './lib/server/http';
import { crossSiteRefusal } from './lib/server/origin-check';
import { securityHeadersFor } from './lib/server/security-headers';

export const onRequest = defineMiddleware(async (context, next) => {
  context.locals.user = null;
  if (context.isPrerendered) return next();

  const response = await answer(context, next);
  for (const [name, value] of Object.entries(securityHeadersFor(context.request))) {
    if (!response.headers.has(name)) response.headers.set(name, value);
  }
  return response;
});

async function answer(context: APIContext, next: MiddlewareNext): Promise<Response> {
  const refusal = crossSiteRefusal(context.request);
  if (refusal) {
    console.warn(`[security] refused ${context.request.method} ${context.url.pathname}: ${refusal}`);
    return errorResponse(403, 'This request came from another site and was refused. Open Tickover itself and try again.');
  }

  const access = pageAccess(context.url.pathname);
  if (access.kind !== 'public' || context.url.pathname === '/' || context.url.pathname.startsWith('/sign-in')) {
    context.locals.user = await readSession(context.request.headers);
  }
  const user = context.locals.user;

  if (access.kind === 'api' && !user) return errorResponse(401, 'Sign in first.');
  if (access.kind === 'roles' && !user) {
    const nextPath = context.url.pathname + context.url.search;
    return context.redirect(`/sign-in?next=${encodeURIComponent(nextPath)}`, 303);
  }
  if (access.kind === 'roles' && user && !access.roles.includes(user.role)) return context.redirect(homeFor(user.role), 303);
  return next();
}
