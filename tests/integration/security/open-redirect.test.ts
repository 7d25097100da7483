// Defect 3 of issue 16: after sign-in, `next` must never take the browser to another host.
// The WHATWG URL parser used here is the one browsers follow (https://url.spec.whatwg.org/):
// a backslash counts as a slash in http(s) URLs, and tab/newline characters are removed.
import { isValidElement, type ReactElement } from 'react';
import { describe, expect, it } from 'vitest';
import SignInPage from '@/app/(auth)/sign-in/page';
import { findSafeNextPath } from '@/lib/http/find-safe-next-path';

const origin = 'http://127.0.0.1:3100';

/** The `next` the sign-in page hands to its form for this query. */
async function nextFor(next: string): Promise<string> {
  const page = (await SignInPage({ searchParams: Promise.resolve({ next }) })) as ReactElement<{
    children: unknown;
  }>;
  const found: string[] = [];
  const walk = (node: unknown) => {
    if (Array.isArray(node)) return node.forEach(walk);
    if (!isValidElement(node)) return;
    const props = node.props as { next?: unknown; children?: unknown };
    if (typeof props.next === 'string') found.push(props.next);
    walk(props.children);
  };
  walk(page);
  if (found.length !== 1) throw new Error(`expected one form with a next, found ${found.length}`);
  return found[0]!;
}

const hostile = [
  '/\\evil.example', // a backslash is a slash to the browser: //evil.example
  '/\t/evil.example', // what ?next=/%09/host decodes to; the tab is dropped: //evil.example
  '/\n/evil.example',
  '//evil.example',
  '/\\/evil.example',
  'https://evil.example/driver',
  'javascript:alert(1)',
  '/.//evil.example', // normalises to the path //evil.example, itself protocol-relative
  ' /\\evil.example',
  'driver',
];

describe('open redirect after sign-in (issue 16, defect 3)', () => {
  it('defect 3: next=/\\host, next=/%09/host and the like go home, never to another host', async () => {
    for (const raw of hostile) {
      const next = await nextFor(raw);
      // Where the browser would go: window.location.assign(next) resolves it against our page.
      const target = new URL(next, `${origin}/sign-in`);
      expect(target.origin, JSON.stringify(raw)).toBe(origin);
      expect(next.startsWith('//'), JSON.stringify(raw)).toBe(false);
      expect(next, JSON.stringify(raw)).toBe('/go');
    }
  });

  it('defect 3: a path of our own is kept, with its query', async () => {
    expect(await nextFor('/supervisor/reports?unit=12')).toBe('/supervisor/reports?unit=12');
    expect(await nextFor('/driver')).toBe('/driver');
  });

  it('defect 3: the helper resolves against the given origin and refuses what leaves it', () => {
    expect(findSafeNextPath('/admin/users#x', origin)).toBe('/admin/users#x');
    expect(findSafeNextPath('/a/../admin', origin)).toBe('/admin');
    expect(findSafeNextPath(`${origin}/admin`, origin)).toBe('/go');
    expect(findSafeNextPath(undefined, origin)).toBe('/go');
    expect(findSafeNextPath('/%2F%2Fevil.example', origin)).toBe('/%2F%2Fevil.example');
    expect(new URL(findSafeNextPath('/%2F%2Fevil.example', origin), origin).origin).toBe(origin);
  });
});
