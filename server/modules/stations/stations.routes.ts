import { Router } from 'express'
import type { ServiceContext } from '../../context'
import { actorOf, requireRole } from '../../http/authenticate'
import { parseWith } from '../../http/validate'
import { idParamSchema } from '../../../shared/schemas/ids'
import { inspectUploadSchema, registerImportSchema, registerVersionParamSchema, stationSearchSchema } from '../../../shared/schemas/stations'
import { candidateSourcesInputSchema } from '../../../shared/calculations/kinds'
import {
  confirmRegisterImport,
  getStation,
  getVersion,
  inspectRegisterFile,
  listVersions,
  previewRegisterImport,
  rankCandidatesNow,
  searchStations,
  uploadRegisterFile,
} from './stations.service'

/** The licence register: staff read it; the policy lets administrators import new versions. */
export function stationRegisterRoutes(ctx: ServiceContext): Router {
  const r = Router()
  const staff = requireRole('investigator', 'supervisor', 'admin')
  r.post('/station-register/uploads', staff, async (req, res) => {
    res.status(201).json({ inspection: await uploadRegisterFile(ctx, actorOf(req), req, res) })
  })
  r.post('/station-register/uploads/:id/inspect', staff, async (req, res) => {
    const { id } = parseWith(idParamSchema, req.params)
    res.json({ inspection: await inspectRegisterFile(ctx, actorOf(req), id, parseWith(inspectUploadSchema, req.body).delimiter) })
  })
  r.post('/station-register/uploads/:id/preview', staff, async (req, res) => {
    const { id } = parseWith(idParamSchema, req.params)
    res.json({ report: await previewRegisterImport(ctx, actorOf(req), id, parseWith(registerImportSchema, req.body)) })
  })
  r.post('/station-register/uploads/:id/confirm', staff, async (req, res) => {
    const { id } = parseWith(idParamSchema, req.params)
    res.status(201).json(await confirmRegisterImport(ctx, actorOf(req), id, parseWith(registerImportSchema, req.body)))
  })
  r.get('/station-register/stations', staff, async (req, res) => {
    res.json(await searchStations(ctx, actorOf(req), parseWith(stationSearchSchema, req.query)))
  })
  r.get('/station-register/stations/:id', staff, async (req, res) => {
    const { id } = parseWith(idParamSchema, req.params)
    res.json({ station: await getStation(ctx, actorOf(req), id) })
  })
  r.get('/station-register/versions', staff, async (req, res) => {
    res.json({ versions: await listVersions(ctx, actorOf(req)) })
  })
  r.get('/station-register/versions/:version', staff, async (req, res) => {
    const { version } = parseWith(registerVersionParamSchema, req.params)
    res.json(await getVersion(ctx, actorOf(req), version))
  })
  r.post('/station-register/candidates', staff, async (req, res) => {
    res.json({ ranking: await rankCandidatesNow(ctx, actorOf(req), parseWith(candidateSourcesInputSchema, req.body)) })
  })
  return r
}
