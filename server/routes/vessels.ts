import { Router } from 'express';
import { z } from 'zod';
import { gensetInputSchema, vesselInputSchema, vesselUpdateSchema } from '../../shared/schemas/vessels';
import type { AppDeps } from '../context';
import { idParam, parseBody } from '../lib/parse';
import { actorOf, requireCapability } from '../middleware/auth';
import {
  addBusSection,
  createGenset,
  createVessel,
  deleteGenset,
  deleteVessel,
  getVessel,
  listVessels,
  updateGenset,
  updateVessel,
} from '../services/vessels';

const busSectionInput = z.object({ name: z.string().trim().min(1, 'Enter a section name').max(20) });

export function vesselsRouter(deps: AppDeps): Router {
  const r = Router();

  r.get('/', requireCapability('fleet:read'), async (req, res) => {
    res.json(await listVessels(deps, actorOf(req)));
  });

  r.post('/', requireCapability('vessels:create'), async (req, res) => {
    const input = parseBody(vesselInputSchema, req.body, 'vessel');
    res.status(201).json(await createVessel(deps, actorOf(req), input));
  });

  r.get('/:vesselId', requireCapability('fleet:read'), async (req, res) => {
    res.json(await getVessel(deps, actorOf(req), idParam(req.params.vesselId, 'Vessel')));
  });

  r.patch('/:vesselId', requireCapability('vessels:edit'), async (req, res) => {
    const input = parseBody(vesselUpdateSchema, req.body, 'vessel');
    res.json(await updateVessel(deps, actorOf(req), idParam(req.params.vesselId, 'Vessel'), input));
  });

  r.delete('/:vesselId', requireCapability('vessels:delete'), async (req, res) => {
    await deleteVessel(deps, actorOf(req), idParam(req.params.vesselId, 'Vessel'));
    res.status(204).end();
  });

  r.post('/:vesselId/bus-sections', requireCapability('plant:edit'), async (req, res) => {
    const input = parseBody(busSectionInput, req.body, 'bus section');
    res.status(201).json(await addBusSection(deps, actorOf(req), idParam(req.params.vesselId, 'Vessel'), input.name));
  });

  r.post('/:vesselId/gensets', requireCapability('plant:edit'), async (req, res) => {
    const input = parseBody(gensetInputSchema, req.body, 'genset');
    res.status(201).json(await createGenset(deps, actorOf(req), idParam(req.params.vesselId, 'Vessel'), input));
  });

  r.patch('/:vesselId/gensets/:gensetId', requireCapability('plant:edit'), async (req, res) => {
    const input = parseBody(gensetInputSchema, req.body, 'genset');
    res.json(
      await updateGenset(deps, actorOf(req), idParam(req.params.vesselId, 'Vessel'), idParam(req.params.gensetId, 'Genset'), input),
    );
  });

  r.delete('/:vesselId/gensets/:gensetId', requireCapability('plant:edit'), async (req, res) => {
    await deleteGenset(deps, actorOf(req), idParam(req.params.vesselId, 'Vessel'), idParam(req.params.gensetId, 'Genset'));
    res.status(204).end();
  });

  return r;
}
