import { Router } from 'express';
import { rateLimit } from 'express-rate-limit';
import { MeterSimulationRequest } from '../../shared/schemas/meterSimulation';
import { IdParam } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { AppError } from '../errors';
import { currentUser } from '../middleware/auth';
import { simulateCaptureMeter } from '../services/meterSimulationService';

/** A simulation takes up to a few tenths of a second of CPU; this many a minute per person keeps the server shared. */
const SIMULATIONS_PER_MINUTE = 60;

/** Simulating a meter is a read: every signed-in role may run one. */
export function meterSimulationRoutes(ctx: AppContext): Router {
  const limit = rateLimit({
    windowMs: 60_000,
    limit: SIMULATIONS_PER_MINUTE,
    keyGenerator: (req) => String(currentUser(req).id),
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: () => {
      throw new AppError(429, 'too_many_simulations', `At most ${SIMULATIONS_PER_MINUTE} meter simulations a minute; try again shortly`);
    },
  });
  return Router().post('/captures/:id/meter-simulation', limit, async (req, res) => {
    res.json(await simulateCaptureMeter(ctx, IdParam.parse(req.params).id, MeterSimulationRequest.parse(req.body)));
  });
}
