import { createSerwistRoute } from '@serwist/turbopack';
import fs from 'node:fs';
import path from 'node:path';
import { offlinePath } from '@/lib/offline/cache-names';

// Builds app/sw.ts at `next build` (esbuild, with the list of Next's static files to precache) and
// serves it as /serwist/sw.js. The offline page is precached under this build's id, so a new
// build replaces it.
const buildIdFile = path.join(process.cwd(), '.next', 'BUILD_ID');
const revision = fs.existsSync(buildIdFile) ? fs.readFileSync(buildIdFile, 'utf8').trim() : crypto.randomUUID();

export const { dynamic, dynamicParams, revalidate, generateStaticParams, GET } = createSerwistRoute({
  swSrc: 'app/sw.ts',
  useNativeEsbuild: true,
  globPatterns: ['.next/static/**/*.{js,css,woff2,png,svg,ico,webp}', 'public/**/*.{png,svg,ico}'],
  additionalPrecacheEntries: [{ url: offlinePath, revision }],
  maximumFileSizeToCacheInBytes: 4 * 1024 * 1024,
});
