import type { Metadata, Viewport } from 'next';
import localFont from 'next/font/local';
import { cookies } from 'next/headers';
import type { ReactNode } from 'react';
import { Providers } from './providers';
import './globals.css';

const body = localFont({
  src: [
    {
      path: '../node_modules/@fontsource-variable/atkinson-hyperlegible-next/files/atkinson-hyperlegible-next-latin-wght-normal.woff2',
      style: 'normal',
      weight: '200 800',
    },
    {
      path: '../node_modules/@fontsource-variable/atkinson-hyperlegible-next/files/atkinson-hyperlegible-next-latin-wght-italic.woff2',
      style: 'italic',
      weight: '200 800',
    },
  ],
  variable: '--font-body',
  display: 'swap',
});

export const metadata: Metadata = {
  title: { default: 'RigCall', template: '%s · RigCall' },
  description: 'Hands-free walk-around inspections for tractor-trailers: findings, defects, repairs and records.',
  applicationName: 'RigCall',
  appleWebApp: { capable: true, title: 'RigCall', statusBarStyle: 'black-translucent' },
  icons: { apple: '/icons/apple-touch-icon.png' },
};

export const viewport: Viewport = {
  width: 'device-width',
  initialScale: 1,
  themeColor: [
    { media: '(prefers-color-scheme: light)', color: '#f2efe6' },
    { media: '(prefers-color-scheme: dark)', color: '#111316' },
  ],
};

export default async function RootLayout({ children }: { children: ReactNode }) {
  const theme = (await cookies()).get('rigcall-theme')?.value;
  return (
    <html lang="en" data-theme={theme === 'day' || theme === 'night' ? theme : undefined} className={body.variable}>
      <body className="min-h-dvh bg-ground text-ink antialiased">
        <Providers>{children}</Providers>
      </body>
    </html>
  );
}
