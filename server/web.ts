// Serves the web export: static files, and index.html for any other page path so deep links open the app.
import express, { type Router } from 'express';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { distDir, WORKER_FILE } from './web-build';

export function webRouter(): Router {
  const r = express.Router();
  r.use(express.static(distDir, { index: false, maxAge: '1h', setHeaders: noCacheForHtml }));
  r.get('/{*splat}', (req, res, next) => {
    if (req.path.startsWith('/api/') || req.path.startsWith('/sync/')) return next();
    const index = path.join(distDir, 'index.html');
    if (!existsSync(index)) {
      res.status(503).type('text/plain').send('The web app is not built yet. Run `npm run build:web` (npm start does it for you).');
      return;
    }
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(index);
  });
  return r;
}

// The solve worker keeps one name across builds, so it must be checked each time like the HTML.
function noCacheForHtml(res: express.Response, file: string) {
  if (file.endsWith('.html') || path.basename(file) === WORKER_FILE) res.setHeader('Cache-Control', 'no-cache');
}
