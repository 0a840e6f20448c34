import { fileURLToPath } from 'node:url'
import { NON_PAGE_CSP } from './shared/security-policy'

// Voltwright: Nuxt 4 app, Nitro server routes, PostgreSQL through Sequelize.
export default defineNuxtConfig({
  compatibilityDate: '2026-11-01',
  modules: ['@nuxtjs/tailwindcss', '@pinia/nuxt', 'nuxt-auth-utils', 'nuxt-security', '@nuxt/eslint'],
  devtools: { enabled: false },
  // Links fetch the code of the page they lead to when touched or hovered, not whenever they come into view:
  // a phone at the roadside downloads only the page it is on.
  experimental: { defaults: { nuxtLink: { prefetchOn: { visibility: false, interaction: true } } } },
  telemetry: false,
  css: [
    '@fontsource/ibm-plex-sans/400.css',
    '@fontsource/ibm-plex-sans/500.css',
    '@fontsource/ibm-plex-sans/600.css',
    '~/assets/css/main.css'
  ],
  app: {
    head: {
      htmlAttrs: { lang: 'en-GB' },
      title: 'Voltwright',
      meta: [
        { name: 'viewport', content: 'width=device-width, initial-scale=1' },
        { name: 'description', content: 'The register of motor-controller tuning profiles for converted classic cars.' }
      ],
      link: [{ rel: 'icon', type: 'image/svg+xml', href: '/favicon.svg' }]
    }
  },
  runtimeConfig: {
    databaseUrl: 'postgres://voltwright@127.0.0.1:54329/voltwright',
    s3Endpoint: 'http://127.0.0.1:4569',
    s3Bucket: 'voltwright',
    s3AccessKeyId: '',
    s3SecretAccessKey: '',
    s3Region: 'us-east-1',
    smtpHost: '127.0.0.1',
    smtpPort: 1025,
    smtpTls: 'none',
    smtpUser: '',
    smtpPassword: '',
    mailFrom: 'Voltwright <register@voltwright.test>',
    // Reverse proxies whose X-Forwarded-For names the client for sign-in limits (NUXT_TRUSTED_PROXIES, README).
    trustedProxies: '',
    // A sign-in lasts a working day: after 12 hours the sealed cookie no longer opens.
    session: { maxAge: 60 * 60 * 12 },
    public: { baseUrl: 'http://localhost:3000' }
  },
  // Answers that are not pages (JSON, CSV, PDF, files, scripts) run nothing: a policy that allows nothing, rather
  // than the pages' policy with its nonce placeholder unfilled (docs/security.md).
  routeRules: {
    // JSON answers carry no script or style to which a CSP nonce could apply: none is drawn for them.
    '/api/**': { headers: { 'Content-Security-Policy': NON_PAGE_CSP }, security: { nonce: false } },
    '/_nuxt/**': { headers: { 'Content-Security-Policy': NON_PAGE_CSP } }
  },
  nitro: {
    // The tester is often on a phone with little signal: serve gzip and brotli copies of the built assets.
    compressPublicAssets: { gzip: true, brotli: true },
    // Sequelize loads its dialect by name at run time; pdfkit reads its font data and sharp loads its
    // native binding from their own folders: keep these as real node modules.
    externals: { external: ['sequelize', 'pg', 'pg-hstore', 'pdfkit', 'sharp'] },
    // IBM Plex Sans for the handover PDF, as WOFF (pdfkit cannot read WOFF2).
    serverAssets: [{ baseName: 'fonts', dir: fileURLToPath(new URL('./node_modules/@fontsource/ibm-plex-sans/files', import.meta.url)), pattern: 'ibm-plex-sans-latin*-{400,600}-normal.woff' }]
  },
  security: {
    headers: {
      contentSecurityPolicy: {
        'default-src': ["'self'"],
        'script-src': ["'self'", "'nonce-{{nonce}}'", "'strict-dynamic'"],
        'style-src': ["'self'", "'unsafe-inline'"],
        'img-src': ["'self'", 'data:', 'blob:'],
        'font-src': ["'self'", 'data:'],
        'connect-src': ["'self'"],
        // The road-test wizard's service worker (public/roadside-sw.js).
        'worker-src': ["'self'"],
        'object-src': ["'none'"],
        'base-uri': ["'none'"],
        'form-action': ["'self'"],
        'frame-ancestors': ["'none'"],
        'upgrade-insecure-requests': false
      },
      // Sent by server/middleware/hsts.ts, only over HTTPS.
      strictTransportSecurity: false,
      crossOriginEmbedderPolicy: false,
      xContentTypeOptions: 'nosniff',
      xFrameOptions: 'DENY',
      referrerPolicy: 'same-origin'
    },
    // Limits live in PostgreSQL (server/utils/people/sign-in-limits.ts) so that every instance shares them.
    rateLimiter: false,
    // Telemetry logs may be up to 50 MB; the upload route itself answers 413 above that.
    requestSizeLimiter: { maxRequestSizeInBytes: 2_000_000, maxUploadFileRequestInBytes: 60_000_000 },
    xssValidator: false,
    corsHandler: false
  },
  typescript: { strict: true },
  eslint: { config: { stylistic: false } },
  tailwindcss: { cssPath: false, configPath: 'tailwind.config.ts' }
})
