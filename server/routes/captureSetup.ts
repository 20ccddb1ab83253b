import { Router } from 'express';
import { z } from 'zod';
import { ChannelSetupPatch, CreateProbePresetRequest } from '../../shared/schemas/channelSetup';
import { DeclaredVoltageRequest, TrendQuery } from '../../shared/schemas/powerQuality';
import { SystemsRequest } from '../../shared/schemas/threePhase';
import { IdParam } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { allow, currentUser } from '../middleware/auth';
import { changeChannelSetup, setDeclaredVoltage, setSystems, type SetupOutcome } from '../services/channelSetupService';
import { createPreset, projectPresets, removePreset } from '../services/probePresetService';
import { channelTrend } from '../services/trendService';

const ChannelParams = z.object({ id: z.coerce.number().int().positive(), index: z.coerce.number().int().min(0).max(255) });

/** Channel setup, three-phase sets, declared voltage, cycle-by-cycle trends and probe presets. */
export function captureSetupRoutes(ctx: AppContext, onQueued: () => void): Router {
  // 202 when a re-analysis will apply the change, 200 when it is in effect already.
  const answer = (res: { status(n: number): { json(b: unknown): void } }, r: SetupOutcome) => {
    if (r.pending) onQueued();
    res.status(r.pending ? 202 : 200).json(r.capture);
  };
  return Router()
    .patch('/captures/:id/channels/:index', allow('admin', 'engineer'), async (req, res) => {
      const { id, index } = ChannelParams.parse(req.params);
      answer(res, await changeChannelSetup(ctx, currentUser(req), id, index, ChannelSetupPatch.parse(req.body)));
    })
    .put('/captures/:id/systems', allow('admin', 'engineer'), async (req, res) => {
      answer(res, await setSystems(ctx, currentUser(req), IdParam.parse(req.params).id, SystemsRequest.parse(req.body)));
    })
    .delete('/captures/:id/systems', allow('admin', 'engineer'), async (req, res) => {
      answer(res, await setSystems(ctx, currentUser(req), IdParam.parse(req.params).id, null));
    })
    .put('/captures/:id/declared-voltage', allow('admin', 'engineer'), async (req, res) => {
      answer(res, await setDeclaredVoltage(ctx, currentUser(req), IdParam.parse(req.params).id, DeclaredVoltageRequest.parse(req.body).declaredVoltage));
    })
    .get('/captures/:id/trend', async (req, res) => {
      res.json(await channelTrend(ctx, IdParam.parse(req.params).id, TrendQuery.parse(req.query)));
    })
    .get('/projects/:id/probe-presets', async (req, res) => {
      res.json({ items: await projectPresets(ctx, currentUser(req), IdParam.parse(req.params).id) });
    })
    .post('/projects/:id/probe-presets', allow('admin', 'engineer'), async (req, res) => {
      res.status(201).json(await createPreset(ctx, currentUser(req), IdParam.parse(req.params).id, CreateProbePresetRequest.parse(req.body)));
    })
    .delete('/probe-presets/:id', allow('admin', 'engineer'), async (req, res) => {
      await removePreset(ctx, currentUser(req), IdParam.parse(req.params).id);
      res.status(204).end();
    });
}
