import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { compression } from 'vite-plugin-compression2';

// The client. In development /api goes to the Express server started beside it.
export default defineConfig({
  plugins: [
    react(),
    tailwindcss(),
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
