import { defineConfig, type Plugin } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { compression } from 'vite-plugin-compression2';

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
