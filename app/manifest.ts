import type { MetadataRoute } from 'next';

// The installable app: opens at the signed-in home in its own window, in the asphalt and vest
// colours of app/globals.css (chalk ground by day; the icons are asphalt with a vest check).
export default function manifest(): MetadataRoute.Manifest {
  return {
    id: '/',
    name: 'RigCall',
    short_name: 'RigCall',
    description: 'Hands-free walk-around inspections for tractor-trailers.',
    start_url: '/go',
    scope: '/',
    display: 'standalone',
    orientation: 'portrait',
    background_color: '#111316',
    theme_color: '#111316',
    categories: ['business', 'productivity'],
    icons: [
      { src: '/icons/icon-192.png', sizes: '192x192', type: 'image/png', purpose: 'any' },
      { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png', purpose: 'any' },
      { src: '/icons/icon-maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
    ],
  };
}
