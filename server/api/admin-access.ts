import { createHmac, timingSafeEqual } from 'node:crypto';
import type { Context, Hono, MiddlewareHandler } from 'hono';
import { getCookie, setCookie, deleteCookie } from 'hono/cookie';
import { ApiError } from './api-error.js';
import { bearerKey } from './router-keys.js';

const COOKIE = 'sheaf_session';

/** Requests that never need the admin token: liveness, and routing (which has its own keys). */
function isOpen(method: string, path: string): boolean {
  if (path === '/api/v1/health' || path === '/login' || path === '/login.css' || path === '/logout') return true;
  return method === 'POST' && /^\/api\/v1\/routers\/[^/]+\/route$/.test(path);
}

function equal(a: string, b: string): boolean {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  // Compare equal-length digests so the time does not depend on where the strings differ.
  const hx = createHmac('sha256', 'sheaf-compare').update(x).digest();
  const hy = createHmac('sha256', 'sheaf-compare').update(y).digest();
  return timingSafeEqual(hx, hy) && x.length === y.length;
}

/** The session cookie value: derived from the token, so changing the token ends every session. */
function sessionValue(token: string): string {
  return createHmac('sha256', token).update('sheaf-session-v1').digest('hex');
}

const LOGIN_CSS = `body{font:16px/1.5 system-ui,sans-serif;background:#f6f4ef;color:#222;display:grid;place-items:center;min-height:100vh;margin:0}
form{background:#fff;padding:2rem;border-radius:12px;box-shadow:0 2px 12px #0001;width:min(22rem,90vw)}
h1{font-size:1.3rem;margin:0 0 1rem}label{display:block;margin-bottom:.4rem}
input{width:100%;box-sizing:border-box;padding:.55rem;font:inherit;border:1px solid #aaa;border-radius:6px}
button{margin-top:1rem;padding:.55rem 1.2rem;font:inherit;border:0;border-radius:6px;background:#2d5d7b;color:#fff;cursor:pointer}
p.err{color:#a3262a}`;

// The page has no inline script or style, so it lives under the same strict CSP as the app.
const LOGIN_PAGE = (message: string) => `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>sheaf — sign in</title>
<meta name="viewport" content="width=device-width, initial-scale=1"><link rel="stylesheet" href="/login.css">
</head><body>
<form method="post" action="/login"><h1>sheaf</h1>${message ? `<p class="err">${message}</p>` : ''}
<label for="token">Admin token</label><input id="token" name="token" type="password" autocomplete="current-password" required autofocus>
<button type="submit">Sign in</button></form></body></html>`;

/**
 * When ADMIN_TOKEN is set, every request except health and routing needs it: as
 * `Authorization: Bearer <token>` (scripts) or the session cookie set by the sign-in page (people).
 */
export function adminAccess(app: Hono, token: string | null): void {
  if (!token) return;
  const session = sessionValue(token);
  app.get('/login', (c) => c.html(LOGIN_PAGE('')));
  app.get('/login.css', (c) => c.body(LOGIN_CSS, 200, { 'Content-Type': 'text/css; charset=utf-8' }));
  app.post('/login', async (c) => {
    const form = await c.req.parseBody().catch(() => ({}) as Record<string, unknown>);
    const given = typeof form.token === 'string' ? form.token : '';
    if (!equal(given, token)) return c.html(LOGIN_PAGE('That token is not right.'), 401);
    setCookie(c, COOKIE, session, { httpOnly: true, sameSite: 'Strict', path: '/', secure: new URL(c.req.url).protocol === 'https:' });
    return c.redirect('/', 303);
  });
  app.post('/logout', (c) => {
    deleteCookie(c, COOKIE, { path: '/' });
    return c.redirect('/login', 303);
  });
  const guard: MiddlewareHandler = async (c: Context, next) => {
    if (isOpen(c.req.method, c.req.path)) return next();
    const bearer = bearerKey(c.req.header('authorization'));
    const cookie = getCookie(c, COOKIE);
    if ((bearer && equal(bearer, token)) || (cookie && equal(cookie, session))) return next();
    if (!c.req.path.startsWith('/api/') && c.req.method === 'GET') return c.redirect('/login', 303);
    throw new ApiError('unauthorized', 'This server needs its admin token: send "Authorization: Bearer <ADMIN_TOKEN>" or sign in at /login.');
  };
  app.use('*', guard);
}
