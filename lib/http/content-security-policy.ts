/**
 * The content security policy of every answer. Scripts run only from our own origin or with this
 * request's nonce ('strict-dynamic' lets a nonced script load the chunks it needs); Next puts the
 * nonce on its own inline scripts when it finds it in the request's policy header. Styles keep
 * 'unsafe-inline' (React writes style attributes); photo previews are blob: URLs, fonts come from
 * our own /_next/static, speech runs in the browser.
 */
export function buildContentSecurityPolicy(nonce: string, { dev = false }: { dev?: boolean } = {}): string {
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${dev ? " 'unsafe-eval'" : ''}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' blob: data:",
    "font-src 'self' data:",
    `connect-src 'self'${dev ? ' ws:' : ''}`,
    "media-src 'self' blob:",
    "worker-src 'self' blob:",
    "manifest-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join('; ');
}

/** A fresh nonce: 16 random bytes, base64. */
export function makeNonce(): string {
  const bytes = new Uint8Array(16);
  crypto.getRandomValues(bytes);
  return btoa(String.fromCharCode(...bytes));
}
