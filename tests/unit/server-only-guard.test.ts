import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

const root = path.resolve(__dirname, '..', '..');
const serverFolders = ['lib/db', 'lib/auth', 'lib/mail', 'lib/storage', 'lib/services', 'lib/api'];
// Universal helpers that live beside server code on purpose (no secrets, no I/O).
const universal = new Set(['lib/auth/roles.ts']);

function filesUnder(dir: string): string[] {
  const abs = path.join(root, dir);
  if (!fs.existsSync(abs)) return [];
  return fs.readdirSync(abs, { withFileTypes: true }).flatMap((e) => {
    const rel = path.join(dir, e.name);
    if (e.isDirectory()) return filesUnder(rel);
    return /\.tsx?$/.test(e.name) && !/\.test\.tsx?$/.test(e.name) ? [rel] : [];
  });
}

describe('server-only boundary', () => {
  const files = [...serverFolders.flatMap(filesUnder), 'lib/env.ts'].filter((f) => !universal.has(f));

  it('finds the server files', () => {
    expect(files.length).toBeGreaterThan(8);
  });

  it.each(files)('%s starts with import "server-only"', (file) => {
    const first = fs
      .readFileSync(path.join(root, file), 'utf8')
      .split('\n')
      .find((l) => l.trim() && !l.trim().startsWith('//'));
    // A bare 'server-only'; string would do nothing: it must be an import.
    expect(first?.trim()).toMatch(/^import ['"]server-only['"];?$/);
  });

  it('no client component imports code from a server folder', () => {
    const clientFiles = ['app', 'components']
      .flatMap(filesUnder)
      .filter((f) => /^['"]use client['"]/.test(fs.readFileSync(path.join(root, f), 'utf8').trim()));
    expect(clientFiles.length).toBeGreaterThan(0);
    for (const f of clientFiles) {
      const text = fs.readFileSync(path.join(root, f), 'utf8');
      for (const folder of serverFolders) {
        // `import type` is erased at build time and cannot pull server code into the browser.
        const imports = [
          ...text.matchAll(new RegExp(`^import (?!type )[^;]*?from ['"](@/${folder}[^'"]*)['"]`, 'gm')),
        ].map((m) => m[1]!);
        // roles.ts is the one universal file beside the server code.
        expect(
          imports.filter((i) => !universal.has(`${i.slice(2)}.ts`)),
          `${f} imports ${folder}`,
        ).toEqual([]);
      }
    }
  });
});
