import { Router } from 'express';
import { MeterProfileListQuery, SaveMeterProfileRequest } from '../../shared/schemas/savedMeterProfile';
import { IdParam } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { currentUser } from '../middleware/auth';
import { meterProfilesFor, removeMeterProfile, saveMeterProfile } from '../services/meterProfileService';

/** Saved meter front ends. Every role may save into its own account, so the project rule lives in the service. */
export function meterProfileRoutes(ctx: AppContext): Router {
  return Router()
    .get('/meter-profiles', async (req, res) => {
      res.json({ items: await meterProfilesFor(ctx, currentUser(req), MeterProfileListQuery.parse(req.query)) });
    })
    .post('/meter-profiles', async (req, res) => {
      res.status(201).json(await saveMeterProfile(ctx, currentUser(req), SaveMeterProfileRequest.parse(req.body)));
    })
    .delete('/meter-profiles/:id', async (req, res) => {
      await removeMeterProfile(ctx, currentUser(req), IdParam.parse(req.params).id);
      res.status(204).end();
    });
}
