/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  poweredByHeader: false,
  // `npm test` type-checks the whole tree (tests included) with `tsc --noEmit` before it builds;
  // the build does not repeat that work.
  typescript: { ignoreBuildErrors: true },
  // Server-only packages that should stay outside the bundle.
  serverExternalPackages: ['pg', 'nodemailer', 'bcryptjs', 'sharp'],
  async headers() {
    return [
      {
        source: '/:path*',
        headers: [
          { key: 'X-Content-Type-Options', value: 'nosniff' },
          { key: 'Referrer-Policy', value: 'same-origin' },
          { key: 'X-Frame-Options', value: 'DENY' },
          { key: 'Permissions-Policy', value: 'camera=(self), microphone=(self), geolocation=(self)' },
        ],
      },
    ];
  },
};

export default nextConfig;
