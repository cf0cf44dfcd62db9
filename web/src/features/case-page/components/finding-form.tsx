/**
 * The investigator's finding: the source, where it is and whose it is, the stored calculations
 * and the case's evidence files it rests on, the recommended action and its deadline, and a summary. Checked by the server's
 * own schema as it is typed; the server's answer (a calculation of another case, say) is put
 * beside the field it concerns.
 */
import { zodResolver } from '@hookform/resolvers/zod'
import { useState } from 'react'
import { useForm } from 'react-hook-form'
import { RECOMMENDED_ACTIONS, RECOMMENDED_ACTION_LABELS } from '@shared/domain/findings'
import { earliestDeadline, PROPOSE_FINDING_FIELDS, proposeFindingSchema, type ProposeFindingInput } from '@shared/schemas/findings'
import { EnforcementCaution } from '@/components/cautions/enforcement-caution'
import { ChoiceGroup } from '@/components/ui/choice-group'
import { FieldError } from '@/components/ui/field'
import { SelectField } from '@/components/ui/select-field'
import { TextAreaField } from '@/components/ui/text-area-field'
import { TextField } from '@/components/ui/text-field'
import { linkableEvidence, shortHash, useCaseEvidence } from '@/lib/case-evidence'
import { useCaseCalculations } from '../api/get-case-calculations'
import { useProposeFinding } from '../api/propose-finding'
import { ActionForm } from './action-form'
import { CalculationBrief } from './calculation-summary'
import { useCaseActionForm } from './use-case-action-form'

const ACTION_OPTIONS = [{ value: '', label: 'Choose the recommended action' }, ...RECOMMENDED_ACTIONS.map((a) => ({ value: a, label: RECOMMENDED_ACTION_LABELS[a] }))]

type FindingFields = Omit<ProposeFindingInput, 'sourceLatDeg' | 'sourceLonDeg' | 'calculationIds'> & {
  sourceLatDeg: string
  sourceLonDeg: string
  calculationIds: string[]
}

export function ProposeFindingForm() {
  const action = useCaseActionForm()
  const caseId = action.detail.id
  const calculations = useCaseCalculations(caseId)
  const evidence = useCaseEvidence(caseId)
  // the files picked (kept outside the form's values: a single check box would give a string, not a list)
  const [evidenceIds, setEvidenceIds] = useState<string[]>([])
  const form = useForm<FindingFields>({
    // the server's schema; the version here only satisfies it, the current one is sent
    resolver: zodResolver(proposeFindingSchema) as never,
    defaultValues: {
      version: action.detail.version,
      sourceDescription: '',
      sourceLatDeg: '',
      sourceLonDeg: '',
      operator: '',
      authorisedStationId: '',
      calculationIds: [],
      evidenceIds: [],
      complianceDeadline: '',
      summary: '',
    },
  })
  const propose = useProposeFinding(caseId)
  const e = form.formState.errors
  const onSubmit = form.handleSubmit(() =>
    action.run({
      send: (version) => propose.mutateAsync({ ...form.getValues(), evidenceIds, version }),
      success: 'Finding proposed. Your supervisor has been asked to review it.',
      setFieldError: form.setError,
      fields: PROPOSE_FINDING_FIELDS,
    }),
  )
  const calcs = calculations.data ?? []
  const files = linkableEvidence(evidence.data?.evidence)
  return (
    <ActionForm
      id="propose-finding"
      title="Propose a finding"
      intro={<p>Your supervisor reviews it with the linked calculations, then closes the case or sends it back.</p>}
      submitLabel="Propose finding"
      pendingLabel="Sending…"
      submitting={form.formState.isSubmitting}
      onSubmit={onSubmit}
      action={action}
    >
      <TextAreaField label="The source" id="finding-source" rows={2} hint="What is transmitting, and where." error={e.sourceDescription?.message} {...form.register('sourceDescription')} />
      <fieldset className="flex flex-col gap-3">
        <legend className="mb-1 font-semibold">Source position (optional)</legend>
        <div className="grid gap-3 sm:grid-cols-2">
          <TextField label="Latitude" id="finding-lat" inputMode="decimal" hint="Degrees, north positive, like 48.1021" error={e.sourceLatDeg?.message} {...form.register('sourceLatDeg')} />
          <TextField label="Longitude" id="finding-lon" inputMode="decimal" hint="Degrees, east positive, like -31.3504" error={e.sourceLonDeg?.message} {...form.register('sourceLonDeg')} />
        </div>
      </fieldset>
      <TextField label="Operator or licensee (if known)" id="finding-operator" error={e.operator?.message} {...form.register('operator')} />
      <TextField
        label="Authorised station id (optional)"
        id="finding-station"
        hint="The station's id in the licence register, when the source is a licensed station."
        error={e.authorisedStationId?.message}
        {...form.register('authorisedStationId')}
      />
      {calculations.isPending ? (
        <p className="text-sm text-ink-muted">Loading the case’s calculations…</p>
      ) : calculations.isError ? (
        <p className="text-sm text-danger">The case’s calculations could not be loaded; you can still propose without linking any.</p>
      ) : calcs.length === 0 ? (
        <div>
          <p className="font-semibold">Calculations</p>
          <p className="text-sm text-ink-muted">No calculations are stored on this case yet.</p>
          <FieldError id="field-calculationIds-error" message={e.calculationIds?.message} />
        </div>
      ) : (
        <ChoiceGroup
          legend="Calculations the finding rests on"
          name="calculationIds"
          type="checkbox"
          hint="Stored records of this case; the supervisor sees their numbers, intervals and warnings."
          options={calcs.map((c) => ({ value: c.id, label: <CalculationBrief calc={c} /> }))}
          inputProps={form.register('calculationIds')}
          error={e.calculationIds?.message ?? e.calculationIds?.root?.message}
        />
      )}
      {evidence.isPending ? (
        <p className="text-sm text-ink-muted">Loading the case’s evidence files…</p>
      ) : evidence.isError ? (
        <p className="text-sm text-danger">The case’s evidence files could not be loaded; you can still propose without linking any.</p>
      ) : files.length === 0 ? (
        <div>
          <p className="font-semibold">Evidence files</p>
          <p className="text-sm text-ink-muted">No evidence files are on this case.</p>
          <FieldError id="field-evidenceIds-error" message={e.evidenceIds?.message} />
        </div>
      ) : (
        <ChoiceGroup
          legend="Evidence files the finding rests on"
          name="evidenceIds"
          type="checkbox"
          hint="Files of this case; the supervisor sees each with its name and hash."
          options={files.map((f) => ({
            value: f.id,
            label: (
              <span className="break-all">
                {f.originalName} <span className="font-mono text-sm text-ink-muted">SHA-256 {shortHash(f.sha256)}…</span>
              </span>
            ),
          }))}
          inputProps={{
            onChange: (ev) => {
              const { value, checked } = ev.currentTarget
              setEvidenceIds((ids) => (checked ? [...ids.filter((x) => x !== value), value] : ids.filter((x) => x !== value)))
            },
          }}
          error={e.evidenceIds?.message ?? e.evidenceIds?.root?.message}
        />
      )}
      <EnforcementCaution />
      <SelectField label="Recommended action" id="finding-action" options={ACTION_OPTIONS} error={e.recommendedAction?.message} {...form.register('recommendedAction')} />
      <TextField
        label="Compliance deadline (optional)"
        id="finding-deadline"
        type="date"
        min={earliestDeadline()}
        hint="The date by which the operator should comply."
        error={e.complianceDeadline?.message}
        {...form.register('complianceDeadline')}
      />
      <TextAreaField
        label="Finding summary"
        id="finding-summary"
        rows={5}
        hint="What you found, where and what you measured, and why you recommend this action."
        error={e.summary?.message}
        {...form.register('summary')}
      />
    </ActionForm>
  )
}
