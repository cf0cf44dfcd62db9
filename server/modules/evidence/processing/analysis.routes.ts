import { Router } from 'express'
import { idParamSchema } from '../../../../shared/schemas/ids'
import type { ServiceContext } from '../../../context'
import { actorOf, requireRole } from '../../../http/authenticate'
import { parseWith } from '../../../http/validate'
import { bandRequestSchema } from '../../../../shared/schemas/spectrum'
import { evidenceNotFound, getEvidenceAnalysis } from './analysis.service'
import { measureEvidenceBand } from './band.service'
import { recordBandMeasurement } from './band-measurement.service'
import { bandMeasurementRequestSchema } from '../../../../shared/schemas/band-measurement'

/** A spectrum evidence file's analysis (summary, display trace, spectrogram): staff of its office. */
export function evidenceAnalysisRoutes(ctx: ServiceContext): Router {
  const r = Router()
  r.get('/evidence/:id/analysis', requireRole('investigator', 'supervisor'), async (req, res) => {
    const parsed = idParamSchema.safeParse(req.params)
    if (!parsed.success) throw evidenceNotFound()
    res.json({ analysis: await getEvidenceAnalysis(ctx, actorOf(req), parsed.data.id) })
  })
  // channel power and occupied bandwidth of a band of the stored display trace (nothing is stored)
  r.post('/evidence/:id/band', requireRole('investigator', 'supervisor'), async (req, res) => {
    const parsed = idParamSchema.safeParse(req.params)
    if (!parsed.success) throw evidenceNotFound()
    res.json({ band: await measureEvidenceBand(ctx, actorOf(req), parsed.data.id, parseWith(bandRequestSchema, req.body)) })
  })
  // a band's channel power kept as a measurement of the case: the server computes the level itself
  r.post('/evidence/:id/band-measurement', requireRole('investigator', 'supervisor'), async (req, res) => {
    const parsed = idParamSchema.safeParse(req.params)
    if (!parsed.success) throw evidenceNotFound()
    res.status(201).json(await recordBandMeasurement(ctx, actorOf(req), parsed.data.id, parseWith(bandMeasurementRequestSchema, req.body)))
  })
  return r
}
