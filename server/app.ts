import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import express, { type Express, type RequestHandler } from 'express';
import helmet from 'helmet';
import type { Logger } from 'pino';
import { pinoHttp } from 'pino-http';
import type { Sequelize } from 'sequelize';
import swaggerUi from 'swagger-ui-express';
import { openApiDocument, openApiText } from './api/openapi-document';
import { createOperationRouter } from './api/operation-router';
import { createProblemHandler, notFoundHandler, ProblemError } from './api/problem-details';
import { requestLogOptions } from './logging';
import { loadConfig, projectRoot } from './config';
import { createHealthHandlers } from './health/health-handlers';
import { createSelectionHandlers } from './selection/selection-handlers';
import { createAccountHandlers, createOperationGuards } from './accounts/account-routes';
import { accountsDependenciesFrom, type AccountsDependencies } from './accounts/accounts-dependencies';
import { createCableRunHandlers } from './calculations/cable-run-handlers';
import { createCalculationHandlers } from './calculations/calculation-handlers';
import { CatalogSnapshot } from './catalog/catalog-snapshot';
import { createCatalogHandlers } from './catalog/catalog-handlers';
import { createProjectHandlers } from './projects/project-handlers';
import { createProjectHistoryHandlers } from './projects/project-history-handlers';
import { createCurveImportHandlers } from './catalog/curve-import-handlers';
import { createProfileHandlers } from './reports/profile-handlers';
import { createReportHandlers } from './reports/report-handlers';
import { createProjectClientHandlers } from './projects/project-client-handlers';
import { createProposalMailHandlers } from './reports/proposal-mail-handlers';
import { createClientLinkHandlers } from './reports/client-link-handlers';
import { createClientViewHandlers } from './reports/client-view-handlers';
import { clientFilesRouter } from './client-files';

/**
 * JSON bodies are UTF-8 (with or without a byte-order mark) or UTF-16, as the contract says;
 * body-parser alone would decode any charset iconv-lite knows (UTF-32, UTF-7).
 */
const jsonCharsets = new Set(['utf-8', 'utf-16', 'utf-16le', 'utf-16be']);

const acceptedJsonCharset: RequestHandler = (request, _response, next) => {
  if (!request.is('application/json')) return next();
  const charset = /;\s*charset\s*=\s*"?([^";\s]*)/i.exec(request.headers['content-type'] ?? '')?.[1].toLowerCase();
  if (charset === undefined || jsonCharsets.has(charset)) return next();
  next(
    new ProblemError(
      415,
      'Unsupported charset',
      `A JSON body is UTF-8 or UTF-16 (charset utf-8, utf-16, utf-16le or utf-16be), not "${charset.slice(0, 40)}"`,
      [{ pointer: '/headers/content-type', detail: 'charset must be utf-8 or utf-16' }],
    ),
  );
};

export interface AppDependencies {
  sequelize: Sequelize;
  logger: Logger;
  /** The built Angular app; when absent the server answers the API only. */
  clientFolder?: string;
  /** Mail, the address e-mailed links point to, and rate limits; from the configuration when left out. */
  accounts?: Partial<AccountsDependencies>;
  /** Proxies whose forwarding headers are believed; from the configuration when left out. */
  trustedProxies?: string[];
}

export const riffleVersion = (
  JSON.parse(readFileSync(join(projectRoot, 'package.json'), 'utf8')) as { version: string }
).version;

export const defaultClientFolder = join(projectRoot, 'dist', 'riffle', 'browser');

/** Builds the whole web application; it never listens, so tests can drive it directly. */
export function createApp({ sequelize, logger, clientFolder, accounts, trustedProxies }: AppDependencies): Express {
  const config = loadConfig();
  const app = express();
  app.disable('x-powered-by');
  // request.ip (audit log, rate limits) follows X-Forwarded-For only from the listed proxies.
  const proxies = trustedProxies ?? config.trustedProxies;
  app.set('trust proxy', proxies.length > 0 ? proxies : false);
  app.use(
    helmet({
      contentSecurityPolicy: {
        // fonts, icons and styles ship with the app: nothing is loaded from another origin
        directives: {
          'img-src': ["'self'", 'data:', 'blob:'],
          'font-src': ["'self'", 'data:'],
          'style-src': ["'self'", "'unsafe-inline'"],
          'upgrade-insecure-requests': null,
        },
      },
      crossOriginEmbedderPolicy: false,
    }),
  );
  app.use(
    pinoHttp({ ...requestLogOptions, logger, autoLogging: { ignore: (request) => !request.url?.startsWith('/api/') } }),
  );
  app.use(acceptedJsonCharset, express.json({ limit: '1mb' }));

  app.get('/api/v1/openapi.yaml', (_request, response) => {
    response.type('application/yaml').send(openApiText);
  });
  app.use(
    '/api/docs',
    swaggerUi.serve,
    swaggerUi.setup(undefined, {
      swaggerOptions: { url: '/api/v1/openapi.yaml' },
      customSiteTitle: 'Riffle API',
      customCss: '.swagger-ui .topbar { display: none }',
    }),
  );

  // Calculations and selection: one in-memory view of the catalog's current curves.
  const catalogSnapshot = new CatalogSnapshot(sequelize);
  // Accounts and access: sign-in, tokens, admin, and the guard every operation's declaration asks for.
  const accountsDependencies = accountsDependenciesFrom(config, accounts);
  const handlers = {
    ...createHealthHandlers(sequelize, riffleVersion),
    ...createSelectionHandlers(catalogSnapshot),
    ...createAccountHandlers(sequelize, accountsDependencies),
    ...createCalculationHandlers(catalogSnapshot),
    ...createCableRunHandlers(catalogSnapshot),
    ...createCatalogHandlers(sequelize),
    ...createCurveImportHandlers(sequelize),
    ...createProjectHandlers(),
    ...createProfileHandlers(),
    ...createReportHandlers(catalogSnapshot),
    ...createProjectHistoryHandlers(),
    // sending proposals to clients: by mail, and by read-only link
    ...createProjectClientHandlers(),
    ...createProposalMailHandlers(accountsDependencies.mailer),
    ...createClientLinkHandlers(accountsDependencies.publicUrl),
    ...createClientViewHandlers(),
  };
  const guardFor = createOperationGuards(openApiDocument, accountsDependencies.rateLimits);
  app.use('/api/v1', createOperationRouter({ document: openApiDocument, handlers, guardFor }));
  app.use('/api', notFoundHandler);

  if (clientFolder && existsSync(join(clientFolder, 'index.html'))) app.use(clientFilesRouter(clientFolder));
  app.use(notFoundHandler);
  app.use(createProblemHandler(logger));
  return app;
}
