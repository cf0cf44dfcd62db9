/** Chooses one of the case's evidence files (not removed) as a notice's or reply's copy; none by default. */
import { EVIDENCE_KIND_LABELS } from '@shared/domain/evidence'
import { SelectField } from '@/components/ui/select-field'
import { useEvidenceChoices } from '../api/get-evidence-choices'

export function EvidenceSelect(props: { caseId: string; id: string; label: string; name: string; value: string; error?: string; onChange: (e: { target: { value: string } }) => void }) {
  const { caseId, ...field } = props
  const q = useEvidenceChoices(caseId)
  const files = (q.data?.evidence ?? []).filter((e) => !e.removed)
  const options = [
    { value: '', label: q.isPending ? 'Loading the case’s files…' : files.length === 0 ? 'No file on the case' : 'None' },
    ...files.map((e) => ({ value: e.id, label: `${e.originalName} (${EVIDENCE_KIND_LABELS[e.kind]}, ${e.uploadedAt.slice(0, 10)})` })),
  ]
  return <SelectField {...field} options={options} hint={q.isError ? 'The case’s files could not be loaded; record it without one, or try again later.' : undefined} />
}
