// Reads the session for every server-rendered request, guards pages by role, and sets the
// security headers. Prerendered pages (the technician's offline shell) never pass through here
// at request time: they hold no data, and everything they show comes through guarded endpoints.
import { defineMiddleware } from 'astro:middleware';
import { readSession } from './lib/auth';
import { homeFor, pageAccess } from './lib/route-access';
import { errorResponse } from './lib/server/http';
import { securityHeaders } from './lib/server/security-headers';

export const onRequest = defineMiddleware(async (context, next) => {
  context.locals.user = null;
  if (context.isPrerendered) return next();

  const access = pageAccess(context.url.pathname);
  if (access.kind !== 'public' || context.url.pathname === '/' || context.url.pathname.startsWith('/sign-in')) {
    context.locals.user = await readSession(context.request.headers);
  }
  const user = context.locals.user;

  let response: Response;
  if (access.kind === 'api' && !user) {
    response = errorResponse(401, 'Sign in first.');
  } else if (access.kind === 'roles' && !user) {
    const nextPath = context.url.pathname + context.url.search;
    response = context.redirect(`/sign-in?next=${encodeURIComponent(nextPath)}`, 303);
  } else if (access.kind === 'roles' && user && !access.roles.includes(user.role)) {
    response = context.redirect(homeFor(user.role), 303);
  } else {
    response = await next();
  }
  for (const [name, value] of Object.entries(securityHeaders(context.url))) {
    if (!response.headers.has(name)) response.headers.set(name, value);
  }
  return response;
});
