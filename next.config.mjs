/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  poweredByHeader: false,
  // Server-only packages that should stay outside the bundle (esbuild builds the service worker,
  // app/serwist/[path]/route.ts).
  serverExternalPackages: ['pg', 'nodemailer', 'bcryptjs', 'sharp', 'pdfkit', 'esbuild', 'esbuild-wasm'],
  async headers() {
    // Pages and route handlers get their content security policy, with a per-request nonce for
    // scripts, from proxy.ts; Next's static files (which run nothing inline) get this one.
    const staticCsp =
      "default-src 'self'; script-src 'self'; style-src 'self'; img-src 'self' blob: data:; font-src 'self' data:; connect-src 'self'; object-src 'none'; base-uri 'self'; form-action 'self'; frame-ancestors 'none'";
    const common = [
      { key: 'X-Content-Type-Options', value: 'nosniff' },
      { key: 'Cross-Origin-Opener-Policy', value: 'same-origin' },
      { key: 'Referrer-Policy', value: 'same-origin' },
      { key: 'X-Frame-Options', value: 'DENY' },
      { key: 'Permissions-Policy', value: 'camera=(self), microphone=(self), geolocation=(self)' },
    ];
    return [
      { source: '/:path*', headers: common },
      { source: '/_next/static/:path*', headers: [{ key: 'Content-Security-Policy', value: staticCsp }] },
      { source: '/_next/image', headers: [{ key: 'Content-Security-Policy', value: staticCsp }] },
    ];
  },
};

export default nextConfig;
