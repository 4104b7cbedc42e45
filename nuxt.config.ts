// Brinkwater — Nuxt configuration. Runtime settings come from NUXT_* environment variables.
import { fileURLToPath } from 'node:url'
import { workerChunks } from './server/build/worker-chunks'

export default defineNuxtConfig({
  modules: ['@nuxtjs/tailwindcss', '@pinia/nuxt', 'nuxt-auth-utils', '@nuxt/eslint'],
  devtools: { enabled: false },
  app: {
    head: {
      title: 'Brinkwater',
      htmlAttrs: { lang: 'en' },
      meta: [
        { name: 'viewport', content: 'width=device-width, initial-scale=1' },
        { name: 'description', content: 'Brinkwater — tabletop exercises for asteroid ocean-impact response.' },
      ],
      link: [{ rel: 'icon', type: 'image/svg+xml', href: '/favicon.svg' }],
    },
  },
  runtimeConfig: {
    // SQLite file; NUXT_DB_PATH overrides.
    dbPath: '.data/brinkwater.sqlite',
    // Maintenance: serve reads, refuse every write with 503 (NUXT_DB_READ_ONLY=1), e.g. while the file is copied.
    dbReadOnly: false,
    migrationsDir: 'drizzle',
    // Scenario files loaded into the library by the seed; NUXT_SCENARIOS_DIR overrides.
    scenariosDir: 'scenarios',
    // Uploaded attachments; empty: an `attachments` folder beside the database. NUXT_ATTACHMENTS_DIR overrides.
    attachmentsDir: '',
    // Public address used in e-mailed links; NUXT_APP_URL overrides.
    appUrl: 'http://localhost:3000',
    // Seed the demo accounts, scenario and exercise at start (NUXT_SEED_DEMO=1), password NUXT_DEMO_PASSWORD.
    seedDemo: false,
    demoPassword: 'brinkwater-demo',
    smtp: {
      // Empty host: mail goes to the built-in fake SMTP server on 127.0.0.1.
      host: '',
      port: 587,
      secure: false,
      user: '',
      pass: '',
      from: 'Brinkwater <no-reply@brinkwater.test>',
    },
    fakeSmtp: {
      // The local catcher runs whenever no real SMTP host is configured.
      port: 2525,
    },
    // The local catcher keeps account links whole (NUXT_MAILBOX_LINKS=1): for the demo and tests only, where its
    // mailbox stands in for everyone's inbox. Off: stored mails show that a link was sent, not the link.
    mailboxLinks: false,
    session: {
      name: 'brinkwater-session',
      maxAge: 60 * 60 * 12,
      // Secure only behind HTTPS: secureCookies (below) turns it on for every request (server/plugins/05.security.ts);
      // NUXT_SESSION_COOKIE_SECURE=true sets it directly.
      cookie: { sameSite: 'lax', httpOnly: true, secure: false },
    },
    // Served over HTTPS (NUXT_SECURE_COOKIES=1, or an https NUXT_APP_URL): the session cookie is marked Secure.
    secureCookies: false,
    // Behind a reverse proxy (NUXT_TRUST_PROXY=1): client address and host come from X-Forwarded-For / -Host.
    trustProxy: false,
    // The inject scheduler's pass interval and the lease that lets one process of several run it.
    schedulerIntervalMs: 250,
    schedulerLeaseMs: 3000,
    // Redis for Socket.IO across several processes (NUXT_REDIS_URL, e.g. redis://127.0.0.1:6379); empty: one process.
    redisUrl: '',
    // Worker threads for hazard assessments and PDFs (NUXT_WORKER_THREADS); 0: one fewer than the processors, 1 to 4.
    workerThreads: 0,
    // Writes to one exercise per person and minute (answers, scores, notes, clock, releases…); more → 429 (NUXT_WRITE_LIMIT_PER_MINUTE).
    writeLimitPerMinute: 120,
    // Written text (answers, messages, observations, score notes) one exercise's record may hold, MB (NUXT_RECORD_LIMIT_MB).
    recordLimitMb: 16,
    // Live connections one person may hold open in one process (tabs, desks, the wall's sign-in); more are refused.
    socketsPerUser: 12,
  },
  // BW_BUILD_DIR / BW_OUTPUT_DIR let two builds run side by side (e.g. a second working copy's tests).
  buildDir: process.env.BW_BUILD_DIR || '.nuxt',
  compatibilityDate: '2026-05-01',
  nitro: {
    output: { dir: process.env.BW_OUTPUT_DIR || '.output' },
    // Node 20's `module-sync` export condition is not followed by the file tracer (exceljs → async-function and friends).
    externals: { traceInclude: [
      'async-function',
      'generator-function',
      'async-generator-function',
    ].map(p => `node_modules/${p}/require.mjs`) },
    experimental: { websocket: true },
    // The worker threads' entry, bundled with the server (server/workers/pool.ts).
    rollupConfig: { plugins: [workerChunks({ entry: fileURLToPath(new URL('./server/workers/entry.ts', import.meta.url)) })] },
  },
  vite: {
    optimizeDeps: { include: ['socket.io-client', 'dayjs'] },
  },
  typescript: { strict: true },
  telemetry: false,
  eslint: { config: { stylistic: {
    indent: 2,
    quotes: 'single',
    semi: false,
    braceStyle: 'stroustrup',
    commaDangle: 'always-multiline',
  } } },
  tailwindcss: { cssPath: '~/assets/css/main.css' },
})
