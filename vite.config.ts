import { defineConfig, type Plugin } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { compression } from 'vite-plugin-compression2';
import { VitePWA } from 'vite-plugin-pwa';
import { MY_WEEK_CACHE } from './src/lib/offline-cache';

/**
 * Names the code of the athlete's My week (the route's chunk and the chunks it imports, less what the
 * entry loads anyway) in a meta tag, so public/early.js can fetch it beside the app's code on a phone's
 * first load instead of after it: without this the route's code is found only once the app has run.
 */
function myWeekPreload(): Plugin {
  return {
    name: 'rackturn-my-week-preload',
    apply: 'build',
    transformIndexHtml: {
      order: 'post',
      handler(html, { bundle }) {
        if (!bundle) return html;
        const chunks = Object.values(bundle).filter((c) => c.type === 'chunk');
        const route = chunks.find((c) => c.facadeModuleId?.endsWith('/src/app/routes/my-week.tsx'));
        const entry = chunks.find((c) => c.isEntry);
        if (!route || !entry) throw new Error('my-week preload: the My week route or the entry chunk is missing');
        const byName = new Map(chunks.map((c) => [c.fileName, c]));
        const reach = (from: string, seen: Set<string>) => {
          if (seen.has(from)) return;
          seen.add(from);
          for (const next of byName.get(from)?.imports ?? []) reach(next, seen);
        };
        const loaded = new Set<string>();
        reach(entry.fileName, loaded);
        const needed = new Set<string>();
        reach(route.fileName, needed);
        const files = [...needed].filter((f) => !loaded.has(f)).map((f) => `/${f}`);
        // Before early.js, which reads it as soon as it runs.
        const early = '<script src="/early.js"';
        if (!html.includes(early)) throw new Error('my-week preload: index.html no longer loads /early.js');
        return html.replace(early, `<meta name="rackturn-my-week-code" content="${files.join(' ')}" />\n    ${early}`);
      },
    },
  };
}

// The client. In development /api goes to the Express server started beside it.
export default defineConfig({
  plugins: [
    react(),
    tailwindcss(),
    myWeekPreload(),
    // The service worker (workbox, generated at build): the app's files kept for offline use and replaced
    // as a whole by the next build (a new worker takes over at once and the page reloads into it), and
    // the athlete's week answers, asked of the network first and read from the cache only without it.
    // The page clears that cache when someone signs out (clearOfflineCache).
    VitePWA({
      registerType: 'autoUpdate',
      injectRegister: null,
      includeAssets: ['favicon.svg', 'early.js', 'icons/rackturn-180.png'],
      manifest: {
        name: 'Rackturn',
        short_name: 'Rackturn',
        description: 'Weekly max-effort rotation for strength coaches and their athletes.',
        start_url: '/my-week',
        scope: '/',
        display: 'standalone',
        background_color: '#f4f0e6',
        theme_color: '#111b2e',
        icons: [
          { src: '/icons/rackturn-192.png', sizes: '192x192', type: 'image/png' },
          { src: '/icons/rackturn-512.png', sizes: '512x512', type: 'image/png' },
          { src: '/icons/rackturn-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
          { src: '/icons/rackturn.svg', sizes: 'any', type: 'image/svg+xml' },
        ],
      },
      workbox: {
        globPatterns: ['**/*.{js,css,html,svg,png,woff2}'],
        // Source maps and the compressed copies stay on the server.
        globIgnores: ['**/*.map', '**/*.br', '**/*.gz'],
        maximumFileSizeToCacheInBytes: 3 * 1024 * 1024,
        cleanupOutdatedCaches: true,
        clientsClaim: true,
        skipWaiting: true,
        navigateFallback: '/index.html',
        navigateFallbackDenylist: [/^\/api\//],
        runtimeCaching: [
          {
            // Who is signed in, and My week (this week and any week opened, the next one included).
            urlPattern: ({ url, request }) =>
              request.method === 'GET' &&
              url.origin === self.location.origin &&
              (url.pathname === '/api/auth/me' || url.pathname === '/api/my-week'),
            handler: 'NetworkFirst',
            options: {
              cacheName: MY_WEEK_CACHE,
              cacheableResponse: { statuses: [200] },
              expiration: { maxEntries: 16, maxAgeSeconds: 21 * 24 * 3600 },
            },
          },
        ],
      },
    }),
    // Brotli and gzip copies of every text file, served by the app in place of the original.
    compression({ algorithms: ['brotliCompress', 'gzip'], exclude: [/\.map$/], threshold: 512 }),
  ],
  server: {
    proxy: { '/api': { target: `http://127.0.0.1:${process.env.PORT ?? 3000}` } },
  },
  build: {
    outDir: 'dist',
    sourcemap: true,
    chunkSizeWarningLimit: 900,
    rollupOptions: {
      // shared/ is pure by rule (no side effects on import), so a page gets only the contracts it uses,
      // not every schema the barrel re-exports.
      treeshake: { moduleSideEffects: (id: string) => !/[\\/]shared[\\/]/.test(id) },
    },
  },
});
