/** Reading a file's analysis: staff of the case's office; another office's file is not found. */
import type { EvidenceAnalysisView } from '../../../../shared/schemas/spectrum'
import type { ServiceContext } from '../../../context'
import { forbidden, notFound } from '../../../http/errors'
import type { CaseActor } from '../../../policy/case-policy'
import { mayDownloadEvidence, maySeeEvidence } from '../../../policy/evidence-policy'
import { findCase } from '../../cases/cases.repo'
import { findEvidence } from '../evidence.repo'
import { findAnalysis } from './analyses.repo'
import { presentAnalysis } from './analysis.present'

export const evidenceNotFound = () => notFound('evidence_not_found', 'No such evidence file in your office.')

export async function getEvidenceAnalysis(ctx: ServiceContext, actor: CaseActor, evidenceId: string): Promise<EvidenceAnalysisView> {
  const evidence = await findEvidence(ctx.db, evidenceId)
  const c = evidence && (await findCase(ctx.db, evidence.caseId))
  if (!evidence || !c || !maySeeEvidence(actor, c, evidence)) throw evidenceNotFound()
  // the analysis is casework, as the file's content is: the staff who may download it
  if (!mayDownloadEvidence(actor, c, evidence)) throw forbidden()
  return presentAnalysis(evidenceId, await findAnalysis(ctx.db, evidenceId))
}
