/**
 * createApp(deps): the whole HTTP application, without listening. Tests import this.
 */
import path from 'node:path'
import fs from 'node:fs'
import express, { Router } from 'express'
import session from 'express-session'
import connectPgSimple from 'connect-pg-simple'
import helmet from 'helmet'
import type pg from 'pg'
import type PgBoss from 'pg-boss'
import { createDb, pingDatabase } from './db/client'
import type { ServiceContext } from './context'
import { DEFAULT_MAIL_QUEUE_OPTIONS, type MailQueueOptions } from './jobs/boss'
import { apiNotFound, errorHandler } from './http/error-handler'
import { requestId } from './http/request-id'
import { requestLog } from './http/request-log'
import { silentLogger, type Logger } from './log/logger'
import { sameOrigin } from './http/same-origin'
import { configurePassport } from './modules/auth/passport'
import { authRoutes } from './modules/auth/auth.routes'
import type { SignInDelay } from './modules/auth/sign-in-delay'
import { usersRoutes } from './modules/users/users.routes'
import { officesRoutes } from './modules/offices/offices.routes'
import { regionRoutes } from './modules/regions/regions.routes'
import { tileOrigin } from './config/env'
import { mailboxRoutes } from './modules/dev/mailbox.routes'
import { casesRoutes } from './modules/cases/cases.routes'
import { publicCaseRoutes } from './modules/cases/public.routes'
import { bandLimitsRoutes } from './modules/band-limits/band-limits.routes'
import { calculationsRoutes } from './modules/calculations/calculations.routes'
import { equipmentRoutes } from './modules/equipment/equipment.routes'
import { measurementsRoutes } from './modules/measurements/measurements.routes'
import { stationRegisterRoutes } from './modules/stations/stations.routes'
import type { ObjectStore } from './storage/object-store'
import { findingsRoutes } from './modules/findings/findings.routes'
import { evidenceRoutes } from './modules/evidence/evidence.routes'
import { evidenceBundleRoutes } from './modules/evidence-bundle/evidence-bundle.routes'
import { evidenceAnalysisRoutes } from './modules/evidence/processing/analysis.routes'
import { responsiblePartiesRoutes } from './modules/responsible-parties/responsible-parties.routes'
import { followUpsRoutes } from './modules/follow-ups/follow-ups.routes'
import { notificationsRoutes } from './modules/notifications/notifications.routes'
import { caseFileRoutes } from './modules/case-file/case-file.routes'
import { processDemoSigner, type CaseFileSigner } from './modules/case-file/case-file-signing'
import { dashboardRoutes } from './modules/dashboard/dashboard.routes'
import { savedViewsRoutes } from './modules/saved-views/saved-views.routes'
import { retentionRoutes } from './modules/retention/retention.routes'
import { auditRoutes } from './modules/audit/audit.routes'
import { openApiRoutes } from './openapi/openapi.routes'
import type { HealthResponse } from '../shared/schemas/service'

export interface AppDeps {
  pool: pg.Pool
  boss: PgBoss
  sessionSecret: string
  publicUrl: string
  /** Built web app to serve (dist/web); absent in API-only tests. */
  staticDir?: string
  /** Folder of the local SMTP fake; absent when a real SMTP server is configured. */
  mailboxDir?: string
  /** The host the server listens on: the development mailbox is served only on loopback. */
  listenHost?: string
  /** NODE_ENV (process.env.NODE_ENV when absent): never the development mailbox in production. */
  nodeEnv?: string
  /** Wait before answering a sign-in, from the account's recent failures (tests inject a tiny one). */
  signInDelay?: SignInDelay
  mailQueue?: MailQueueOptions
  /** Prune expired sessions periodically (off in tests). */
  pruneSessions?: boolean
  /** Number of proxies in front (for req.ip and secure cookies behind a load balancer). */
  trustProxy?: number
  /** Request and error log (silent when absent, as in most tests). */
  logger?: Logger
  /** The file store (S3) uploads go to; absent, routes that store or read files answer 503 storage_unavailable. */
  objectStore?: ObjectStore
  /** A map tile server (MAP_TILE_URL, MAP_TILE_ATTRIBUTION); absent: the web draws the offline basemap. */
  mapTiles?: { urlTemplate: string; attribution: string }
  /** Signs case files (CASE_FILE_P12_PATH); absent outside production: a DEMO certificate made on first use. */
  caseFileSigner?: CaseFileSigner
}

export interface AppHandle {
  app: express.Express
  /** The API router, for route listings (the route × role matrix test). */
  api: Router
  close(): void
}

export function createApp(deps: AppDeps): AppHandle {
  const db = createDb(deps.pool)
  const ctx: ServiceContext = {
    pool: deps.pool,
    db,
    boss: deps.boss,
    publicUrl: deps.publicUrl.replace(/\/$/, ''),
    mailQueue: deps.mailQueue ?? DEFAULT_MAIL_QUEUE_OPTIONS,
    objectStore: deps.objectStore,
    caseFileSigner: deps.caseFileSigner ? () => deps.caseFileSigner : (deps.nodeEnv ?? process.env.NODE_ENV) === 'production' ? undefined : processDemoSigner,
    now: () => new Date(),
  }
  const app = express()
  app.disable('x-powered-by')
  if (deps.trustProxy) app.set('trust proxy', deps.trustProxy)
  app.use(requestId)
  app.use(requestLog(deps.logger ?? silentLogger))
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: { 'default-src': ["'self'"], 'img-src': ["'self'", 'data:', 'blob:', ...(deps.mapTiles ? [tileOrigin(deps.mapTiles.urlTemplate)] : [])], 'style-src': ["'self'", "'unsafe-inline'"], 'upgrade-insecure-requests': null },
      },
      crossOriginEmbedderPolicy: false,
      // HSTS only means something over https, so it is sent only there (below)
      strictTransportSecurity: false,
    }),
  )
  const hsts = helmet.strictTransportSecurity()
  app.use((req, res, next) => (req.secure ? hsts(req, res, next) : next()))

  const PgStore = connectPgSimple(session)
  // A session lasts one working day from sign-in; it is not rewritten on every request
  // (no rolling expiry, no touch), which saves a database write per API call.
  const store = new PgStore({ pool: deps.pool, tableName: 'session', pruneSessionInterval: deps.pruneSessions ? 15 * 60 : false, disableTouch: true })
  const secureCookies = deps.publicUrl.startsWith('https://')
  const passport = configurePassport(db)

  const api = Router()
  // answers carry private data (complainants' details, internal notes): no browser or proxy keeps them
  api.use((_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store')
    next()
  })
  api.use(express.json({ limit: '200kb' }))
  api.use(sameOrigin([deps.publicUrl]))
  api.use(
    session({
      name: 'qb.sid',
      store,
      secret: deps.sessionSecret,
      resave: false,
      saveUninitialized: false,
      rolling: false,
      proxy: secureCookies && !!deps.trustProxy,
      cookie: { httpOnly: true, sameSite: 'lax', secure: secureCookies, maxAge: 10 * 3600 * 1000 },
    }),
  )
  api.use(passport.session())

  // 503 database_unavailable (error handler) when PostgreSQL is away; a short timeout keeps it cheap
  api.get('/health', async (_req, res) => {
    await pingDatabase(deps.pool)
    const body: HealthResponse = { ok: true }
    res.json(body)
  })
  api.use(authRoutes(ctx, passport, { signInDelay: deps.signInDelay }))
  api.use(usersRoutes(ctx))
  api.use(officesRoutes(ctx))
  api.use(regionRoutes(ctx, { basemap: deps.mapTiles ? { kind: 'tiles', ...deps.mapTiles } : { kind: 'offline' } }))
  api.use(publicCaseRoutes(ctx))
  api.use(casesRoutes(ctx))
  api.use(bandLimitsRoutes(ctx))
  api.use(calculationsRoutes(ctx))
  api.use(equipmentRoutes(ctx))
  api.use(measurementsRoutes(ctx))
  api.use(stationRegisterRoutes(ctx))
  api.use(findingsRoutes(ctx))
  api.use(evidenceRoutes(ctx))
  api.use(evidenceBundleRoutes(ctx))
  api.use(evidenceAnalysisRoutes(ctx))
  api.use(responsiblePartiesRoutes(ctx))
  api.use(followUpsRoutes(ctx))
  api.use(notificationsRoutes(ctx))
  api.use(caseFileRoutes(ctx))
  api.use(dashboardRoutes(ctx))
  api.use(savedViewsRoutes(ctx))
  api.use(retentionRoutes(ctx))
  api.use(auditRoutes(ctx))
  api.use(mailboxRoutes({ dir: deps.mailboxDir, listenHost: deps.listenHost, nodeEnv: deps.nodeEnv ?? process.env.NODE_ENV, trustProxy: deps.trustProxy }))
  api.use(openApiRoutes())
  api.use(apiNotFound)
  app.use('/api', api)

  if (deps.staticDir && fs.existsSync(path.join(deps.staticDir, 'index.html'))) {
    const indexHtml = path.join(deps.staticDir, 'index.html')
    app.use(express.static(deps.staticDir, { index: false, maxAge: '1h' }))
    // every other path is the web app, which shows its own 404 page for unknown paths
    app.get('/{*splat}', (_req, res) => res.sendFile(indexHtml))
  }
  app.use(errorHandler)

  return { app, api, close: () => store.close() }
}
