import cookieParser from 'cookie-parser';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { existsSync } from 'node:fs';
import path from 'node:path';
import type { AppContext } from './context';
import { AppError, errorHandler } from './errors';
import { requireSession } from './middleware/auth';
import { retryAfterHeader } from './middleware/requestLimits';
import { sameOriginForSessions } from './middleware/sameOrigin';
import { projectScopes } from './middleware/projectScopes';
import { accountLinkRoutes } from './routes/accountLinks';
import { adminMailRoutes } from './routes/adminMail';
import { apiTokenRoutes } from './routes/apiTokens';
import { annotationRoutes } from './routes/annotations';
import { authRoutes } from './routes/auth';
import { comparisonRoutes } from './routes/comparisons';
import { complianceRoutes } from './routes/compliance';
import { exportRoutes } from './routes/exports';
import { captureRoutes, type ReadUpload } from './routes/captures';
import { captureSetupRoutes } from './routes/captureSetup';
import { healthRoutes } from './routes/health';
import { projectMemberRoutes } from './routes/projectMembers';
import { meterProfileRoutes } from './routes/meterProfiles';
import { meterSimulationRoutes } from './routes/meterSimulation';
import { projectRoutes } from './routes/projects';
import { reportRoutes } from './routes/reports';
import { sharedRoutes, shareRoutes } from './routes/shares';
import { userRoutes } from './routes/users';

const clientDir = path.resolve('dist/client');

/** The Express application, without listening: tests boot it on port 0. */
export function createApp(ctx: AppContext, hooks: { onCaptureQueued?: () => void; readUpload?: ReadUpload } = {}): Express {
  const app = express();
  app.disable('x-powered-by');
  if (ctx.config.TRUST_PROXY) app.set('trust proxy', /^\d+$/.test(ctx.config.TRUST_PROXY) ? Number(ctx.config.TRUST_PROXY) : ctx.config.TRUST_PROXY);
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: false,
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          // PrimeVue writes its theme's CSS variables into <style> elements at run time.
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'", 'data:'],
          connectSrc: ["'self'"],
          objectSrc: ["'none'"],
          baseUri: ["'self'"],
          frameAncestors: ["'none'"],
          formAction: ["'self'"],
        },
      },
    }),
  );
  app.use(express.json({ limit: '1mb' }));
  app.use(cookieParser());

  const api = express.Router();
  api.use(sameOriginForSessions(ctx));
  api.use(healthRoutes(ctx));
  api.use(authRoutes(ctx));
  api.use(sharedRoutes(ctx));
  api.use(accountLinkRoutes(ctx));
  // Everything below needs a signed-in user.
  api.use(requireSession(ctx));
  // Before any route: ids of projects, captures, comparisons, annotations and shares hidden from the
  // user answer 404, and allow() checks the user's role in the project concerned.
  api.use(projectScopes(ctx));
  api.use(userRoutes(ctx));
  api.use(apiTokenRoutes(ctx));
  const onQueued = hooks.onCaptureQueued ?? (() => undefined);
  api.use(projectRoutes(ctx, onQueued));
  api.use(projectMemberRoutes(ctx));
  api.use(captureRoutes(ctx, onQueued, hooks.readUpload));
  api.use(captureSetupRoutes(ctx, onQueued));
  api.use(annotationRoutes(ctx));
  api.use(comparisonRoutes(ctx));
  api.use(exportRoutes(ctx));
  api.use(reportRoutes(ctx));
  api.use(complianceRoutes(ctx));
  api.use(shareRoutes(ctx));
  api.use(adminMailRoutes(ctx));
  api.use(meterProfileRoutes(ctx));
  api.use(meterSimulationRoutes(ctx));
  api.use(() => {
    throw new AppError(404, 'not_found', 'No such API route');
  });
  app.use('/api', api);

  if (ctx.config.SERVE_CLIENT && existsSync(path.join(clientDir, 'index.html'))) {
    app.use(express.static(clientDir, { index: false, maxAge: '1h' }));
    app.get('/{*splat}', (_req, res) => res.sendFile(path.join(clientDir, 'index.html')));
  }
  app.use(retryAfterHeader, errorHandler);
  return app;
}
