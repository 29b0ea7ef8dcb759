import { Hono, type Context } from 'hono';
import type { AppEnv } from '../env';
import { loadInstrumentText } from '../instruments';
import { loadSharedText } from '../store';

/** The plain page for an unknown share link or path (no script, no inline style: it must pass the CSP). */
export const NOT_FOUND_HTML = `<!doctype html>
<html lang="en">
  <head><meta charset="utf-8" /><meta name="viewport" content="width=device-width, initial-scale=1" />
    <title>Not found · qdpanel</title></head>
  <body>
    <h1>Link not found</h1>
    <p>No panel or instrument profile is stored under this link. Check that the link was copied completely.</p>
    <p><a href="/">Open qdpanel</a></p>
  </body>
</html>
`;

/** An HTML 404 page response. */
export function notFoundPage(): Response {
  return new Response(NOT_FOUND_HTML, { status: 404, headers: { 'content-type': 'text/html; charset=utf-8' } });
}

/** The front end's index.html, or the not-found page when the assets cannot give it. */
async function indexPage(c: Context<AppEnv>): Promise<Response> {
  // The asset layer answers /index.html with a redirect to /, so ask for / itself.
  const index = await c.env.ASSETS.fetch(new Request(new URL('/', c.req.url)));
  if (!index.ok) return notFoundPage();
  return new Response(index.body, { status: 200, headers: { 'content-type': 'text/html; charset=utf-8' } });
}

/**
 * /p/:id, the page route of a share link: the front end's index.html when the panel exists (the page reads the id
 * from its path and fetches /api/v1/panels/<id> itself), else the not-found page.
 */
export const pages = new Hono<AppEnv>().get('/:id', async (c) => {
  const text = await loadSharedText(c.env.PANELS, 'panel', c.req.param('id'));
  return text === null ? notFoundPage() : indexPage(c);
});

/** /i/:id, the page route of an instrument link: the front end when the profile exists, else the not-found page. */
export const instrumentPages = new Hono<AppEnv>().get('/:id', async (c) => {
  const text = await loadInstrumentText(c.env.PANELS, c.req.param('id'));
  return text === null ? notFoundPage() : indexPage(c);
});
