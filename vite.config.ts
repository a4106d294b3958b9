import { defineConfig, type HtmlTagDescriptor, type Plugin } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { VitePWA } from 'vite-plugin-pwa';
import { compression } from 'vite-plugin-compression2';

/**
 * The installable, offline-opening client (docs/offline.md). Workbox's generateSW precaches the built
 * shell — index.html, every script and style chunk, the Lato fonts, the icons — so a reload without a
 * connection still opens the app; client routes fall back to index.html. Nothing under /api is ever
 * cached: those requests always go to the network (NetworkOnly), and the larval-survey outbox
 * (src/features/surveys/offline-queue.ts) keeps surveys until the server has them. The worker is
 * registered by src/pwa/register.ts in production builds only (never by `vite` dev or the tests).
 */
const pwa = VitePWA({
  strategies: 'generateSW',
  registerType: 'autoUpdate',
  injectRegister: false,
  filename: 'sw.js',
  manifestFilename: 'manifest.webmanifest',
  includeAssets: ['icon.svg', 'apple-touch-icon.png'],
  manifest: {
    id: '/',
    name: 'Broodcast',
    short_name: 'Broodcast',
    description: 'Seasonal mosquito and transmission estimates for district health services',
    start_url: '/',
    scope: '/',
    display: 'standalone',
    orientation: 'any',
    // The app's own palette (src/styles.css): accent-800 for the bar, paper behind the splash.
    theme_color: '#26305e',
    background_color: '#f5f4f1',
    icons: [
      { src: '/icon-192.png', sizes: '192x192', type: 'image/png', purpose: 'any' },
      { src: '/icon-512.png', sizes: '512x512', type: 'image/png', purpose: 'any' },
      { src: '/icon-maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
      { src: '/icon.svg', sizes: 'any', type: 'image/svg+xml', purpose: 'any' },
    ],
  },
  workbox: {
    // The shell: markup, every chunk (lazy screens included, so any screen opens offline), styles and
    // the woff2 fonts (every browser that runs service workers reads woff2). The plugin adds the
    // manifest, its icons and `includeAssets`.
    globPatterns: ['**/*.{html,js,css,woff2}'],
    // The .br and .gz copies are for the network only (the browser stores the decoded file).
    globIgnores: ['**/*.{br,gz}'],
    // The chart chunks are large; allow them in the precache rather than leave a screen unopenable offline.
    maximumFileSizeToCacheInBytes: 4 * 1024 * 1024,
    navigateFallback: '/index.html',
    // API addresses are never answered with the shell (nor anything else from a cache).
    navigateFallbackDenylist: [/^\/api(\/|$)/],
    runtimeCaching: [{ urlPattern: ({ url }) => url.pathname.startsWith('/api/') || url.pathname === '/api', handler: 'NetworkOnly' }],
    cleanupOutdatedCaches: true,
    clientsClaim: true,
    skipWaiting: true,
    sourcemap: false,
  },
  // Client tests (happy-dom) and `vite` dev run without a service worker.
  devOptions: { enabled: false },
  disable: !!process.env.VITEST,
});

/**
 * Every text file of the build also written as brotli (.br) and gzip (.gz), once, at build time; the server
 * (server/app.ts, express-static-gzip) sends the one the browser accepts. Fonts (woff2 is already
 * compressed) and files under 1 kB are left alone.
 */
const precompressed = compression({
  include: /\.(js|mjs|css|html|json|svg|webmanifest)$/,
  threshold: 1024,
  algorithms: ['brotliCompress', 'gzip'],
  logLevel: 'silent',
});

/**
 * A first visit is nearly always the sign-in page (no session yet; the service worker serves later ones), so
 * index.html asks for the sign-in screen's chunks beside the entry script (modulepreload) instead of after
 * it has run: one round trip less on a slow network. The screen stays a lazy route; a signed-in person
 * opening another screen fetches these few kilobytes for nothing, once.
 */
const preloadSignIn: Plugin = {
  name: 'broodcast-preload-sign-in',
  apply: 'build',
  transformIndexHtml: {
    order: 'post',
    handler(html, ctx) {
      const bundle = ctx.bundle;
      const page = bundle && Object.values(bundle).find((c) => c.type === 'chunk' && /[\\/]src[\\/]features[\\/]auth[\\/]sign-in\.page\.tsx$/.test(c.facadeModuleId ?? ''));
      if (!bundle || !page || page.type !== 'chunk') return html;
      const files = new Set<string>();
      const walk = (file: string) => {
        const chunk = bundle[file];
        if (files.has(file) || chunk?.type !== 'chunk') return;
        files.add(file);
        chunk.imports.forEach(walk);
      };
      walk(page.fileName);
      const tags: HtmlTagDescriptor[] = [...files]
        .filter((file) => !html.includes(`/${file}"`))
        .map((file) => ({ tag: 'link', attrs: { rel: 'modulepreload', crossorigin: true, href: `/${file}` }, injectTo: 'head' }));
      return { html, tags };
    },
  },
};

export default defineConfig({
  root: '.',
  plugins: [react(), tailwindcss(), pwa, preloadSignIn, ...(process.env.VITEST ? [] : [precompressed])],
  // Nothing inlined as data: URLs, so the Content-Security-Policy can allow fonts from 'self' only.
  build: {
    outDir: 'dist/client',
    emptyOutDir: true,
    sourcemap: false,
    assetsInlineLimit: 0,
    rollupOptions: {
      output: {
        // Each language's texts are their own chunks (src/i18n/index.ts), named texts-<language>-<namespace>-<hash>.js
        // so the network log says which language a page fetched (tests/browser/fast-phone.test.ts).
        chunkFileNames: (chunk) => {
          const texts = /\/i18n\/locales\/([^/]+)\/([^/]+)\.json$/.exec(chunk.facadeModuleId ?? '');
          return texts ? `assets/texts-${texts[1]}-${texts[2]}-[hash].js` : 'assets/[name]-[hash].js';
        },
      },
    },
  },
  server: {
    host: '127.0.0.1',
    port: Number(process.env.VITE_PORT ?? 5173),
    proxy: { '/api': `http://127.0.0.1:${process.env.PORT ?? 5180}` },
  },
});
