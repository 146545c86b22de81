// GET /boreline-sw.js: Boreline's service worker (components/offline/boreline-sw.ts, on Serwist), bundled with its
// precache list by scripts/build-sw.mjs into the build folder after `next build`. Public: it holds build file
// names only. Served from the site's root so that its scope can be the whole site; never cached by the browser's
// HTTP cache, so a new build is seen on the next visit (the update prompt then offers it).
import fs from 'node:fs/promises';
import path from 'node:path';
import { publicHandler } from '@/lib/server/http/handler';
import { AppError } from '@/lib/core/errors';
import { serverEnv } from '@/lib/server/config/env';

export const dynamic = 'force-dynamic';

let built: Promise<string> | null = null;

export const GET = publicHandler(async () => {
  built ??= fs.readFile(path.join(process.cwd(), serverEnv().NEXT_DIST_DIR, 'boreline-sw.js'), 'utf8');
  const body = await built.catch(() => {
    built = null;
    throw new AppError('not_built', 404, 'The service worker was not built: run `npm run build`.');
  });
  return new Response(body, {
    headers: {
      'Content-Type': 'text/javascript; charset=utf-8',
      'Cache-Control': 'no-cache',
      'Service-Worker-Allowed': '/',
    },
  });
});
